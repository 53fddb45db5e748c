/**
 * The async API: createBaker(options) -> Baker with bake(recipe), plan(recipe), lut() and close(). A bake
 * runs the stages lazily behind the content-hash cache: every artifact and intermediate has a key derived
 * from the input bytes, the recipe fields it depends on and its algorithm version, so an unchanged rebake
 * reads only the finished artifacts and a changed option recomputes only what depends on it. What a bake
 * makes is data (tables.ts): the stage and artifact tables that bake and plan both walk.
 */
import { join } from 'node:path';
import { initZstd } from '@lightkiln/codecs';
import { getSharedPool, WorkerPool } from '@lightkiln/pool';
import { EntryCache } from './cache/entry.js';
import { HttpStore, LayeredStore } from './cache/remote.js';
import { FolderStore, MemoryStore, pruneStore } from './cache/store.js';
import { aborted, invalidOption, LightkilnError, toLightkilnError } from './errors.js';
import { sha256Hex, sha256HexYielding } from './hash.js';
import { computeKeys, lutKeys, STAGE_VERSIONS } from './keys.js';
import { assembleManifest } from './manifest.js';
import { resolveLutOptions, resolveRecipe } from './recipe.js';
import { BakeRun, cachedDfg, cachedFile } from './run.js';
import { guardedContext } from './stages/context.js';
import { encodeDfgKtx2 } from './stages/encode.js';
import { readInputFiles } from './stages/source.js';
import { artifactRows, keyLabels, lutRow, planFromTables } from './tables.js';
import { checkOutputFolder, writeAtomically } from './write.js';
export class Baker {
    #pool;
    #ownsPool;
    #store;
    #options;
    #closed = false;
    constructor(options = {}) {
        if (options.threads !== undefined && (!Number.isInteger(options.threads) || options.threads < 0 || options.threads > 256)) {
            throw invalidOption('threads', 'must be an integer in 0..256', options.threads);
        }
        if (options.cacheMaxBytes !== undefined && !(options.cacheMaxBytes >= 0))
            throw invalidOption('cacheMaxBytes', 'must be a number >= 0', options.cacheMaxBytes);
        if (options.targetTileCost !== undefined && !(options.targetTileCost >= 1))
            throw invalidOption('targetTileCost', 'must be a number >= 1', options.targetTileCost);
        this.#options = options;
        if (options.pool !== undefined) {
            this.#pool = options.pool;
            this.#ownsPool = false;
        }
        else if (options.threads === 0) {
            this.#pool = new WorkerPool({ threads: 0 });
            this.#ownsPool = true;
        }
        else {
            this.#pool = getSharedPool(options.threads === undefined ? {} : { threads: options.threads });
            this.#ownsPool = false;
        }
        const cache = options.cache ?? '.lightkiln-cache';
        if (cache !== false && typeof cache !== 'string' && !isStore(cache))
            throw invalidOption('cache', 'must be a folder path, a CacheStore or false', cache);
        if (cache === '')
            throw invalidOption('cache', 'must be a non-empty folder path', cache);
        const base = cache === false ? null : typeof cache === 'string' ? new FolderStore(cache) : cache;
        if (options.remoteCache !== undefined) {
            if (typeof options.remoteCache !== 'string')
                throw invalidOption('remoteCache', 'must be an http(s) URL', typeof options.remoteCache);
            if (base === null)
                throw invalidOption('remoteCache', 'needs a local cache (cache is false)', options.remoteCache);
            let remote;
            try {
                remote = new HttpStore(options.remoteCache, { ...(options.remoteTimeoutMs !== undefined ? { timeoutMs: options.remoteTimeoutMs } : {}) });
            }
            catch (error) {
                throw new LightkilnError('INVALID_OPTION', `option "remoteCache": ${error instanceof Error ? error.message : String(error)}`);
            }
            this.#store = new LayeredStore(base, remote, { ...(options.onWarning !== undefined ? { onWarning: options.onWarning } : {}) });
        }
        else {
            this.#store = base;
        }
    }
    get threads() {
        return this.#pool.threads;
    }
    get store() {
        return this.#store;
    }
    async #prepare(raw) {
        if (this.#closed)
            throw new LightkilnError('INVALID_OPTION', 'the baker is closed');
        const recipe = resolveRecipe(raw);
        return { recipe, ...(await readAndHash(recipe, raw)) };
    }
    /** Reports what a bake of this recipe would read from the cache and what it would compute. */
    async plan(raw) {
        const { recipe, keys } = await this.#prepare(raw);
        const cache = new EntryCache(this.#store);
        const known = new Map();
        const allKeys = [keys.source, keys.pyramid, ...keys.levels, keys.sh, keys.irradianceCube, keys.dfg, ...artifactRows(recipe, keys).map((a) => a.key)];
        await Promise.all(allKeys.map(async (key) => known.set(key, await cache.has(key))));
        const { artifacts, stages } = planFromTables(recipe, keys, (key) => known.get(key) === true);
        return { probe: recipe.name, upToDate: artifacts.every((a) => a.cached), artifacts, stages };
    }
    /** Bakes every artifact of a recipe; with outDir, writes them atomically (nothing is written on failure). */
    async bake(raw, options = {}) {
        const started = performance.now();
        let progressFailure = () => undefined;
        // Work started before the input was read; stopped (and waited for) when the bake fails before it ends.
        const early = new AbortController();
        let earlyWork = null;
        try {
            if (typeof options !== 'object' || options === null)
                throw invalidOption('bake options', 'must be an object', options);
            if (options.signal?.aborted)
                throw aborted(options.signal.reason);
            if (this.#closed)
                throw new LightkilnError('INVALID_OPTION', 'the baker is closed');
            const recipe = resolveRecipe(raw);
            const outDir = options.outDir;
            if (outDir !== undefined && (typeof outDir !== 'string' || outDir === ''))
                throw invalidOption('outDir', 'must be a non-empty folder path', outDir);
            if (outDir !== undefined)
                checkOutputFolder(outDir, recipe.name);
            const cache = new EntryCache(this.#store);
            const guarded = guardedContext(this.#pool, options, this.#options.targetTileCost);
            progressFailure = guarded.failure;
            const ctx = { ...guarded.ctx, signal: guarded.ctx.signal === undefined ? early.signal : AbortSignal.any([guarded.ctx.signal, early.signal]) };
            const run = new BakeRun(recipe, cache, ctx);
            const emit = guarded.emit;
            run.emit = emit;
            // Cache events name their entry; the names are known once the input is hashed (earlier ones wait).
            let labels = null;
            const waiting = [];
            cache.onAccess = (key, hit) => {
                if (labels === null)
                    waiting.push([key, hit]);
                else
                    emit({ type: 'cache', entry: labels.get(key) ?? key, hit });
            };
            // The DFG table needs no input: its file starts now, so the workers have work while this thread
            // reads, hashes and decodes (the artifact table below gets the same build from run.file).
            if (recipe.dfg.enabled) {
                const row = lutRow(recipe, lutKeys(recipe.dfg, recipe.output.supercompression).lutFile);
                earlyWork = run.file(row.key, () => row.build(run, {}));
                earlyWork.catch(() => undefined);
            }
            const { inputs, inputHashes, keys } = await readAndHash(recipe, raw);
            run.attach(inputs, keys);
            labels = keyLabels(recipe, keys);
            for (const [key, hit] of waiting.splice(0))
                cache.onAccess(key, hit);
            const built = await this.#buildArtifacts(run, recipe, keys);
            if (options.signal?.aborted)
                throw aborted(options.signal.reason);
            const artifacts = built.files.map(({ row, file }) => ({
                kind: row.kind, name: row.name, path: outDir === undefined ? null : join(outDir, row.name), format: row.format(file.meta),
                bytes: file.bytes, sha256: sha256Hex(file.bytes), fromCache: file.fromCache,
            }));
            run.timings.total = performance.now() - started;
            const { specular, irradiance, lut } = built.results;
            const manifest = assembleManifest({
                recipe, inputs, inputHashes,
                levels: specular.meta.levels,
                sh: irradiance.meta,
                lutChannels: lut === undefined ? null : lut.meta.channels,
                artifacts: artifacts.map((a) => ({ kind: a.kind, path: a.name, format: a.format, byteLength: a.bytes.length, sha256: a.sha256 })),
                sanitized: specular.meta.sanitized,
                clampedToFormat: { specular: specular.meta.clamped, irradiance: irradiance.meta.clamped },
                timingsMs: run.timings,
                cache: cache.stats,
            });
            const manifestBytes = new TextEncoder().encode(`${JSON.stringify(manifest, null, 2)}\n`);
            artifacts.push({ kind: 'manifest', name: `${recipe.name}.probe.json`, path: outDir === undefined ? null : join(outDir, `${recipe.name}.probe.json`), format: 'json', bytes: manifestBytes, sha256: sha256Hex(manifestBytes), fromCache: false });
            const kept = outDir !== undefined ? writeAtomically(outDir, artifacts) : new Set();
            for (const a of artifacts)
                emit({ type: 'artifact', kind: a.kind, name: a.name, path: a.path, sha256: a.sha256, bytes: a.bytes.length, written: outDir !== undefined && !kept.has(a.name), fromCache: a.fromCache });
            if (this.#store !== null && this.#options.cacheMaxBytes !== undefined)
                await pruneStore(this.#store, this.#options.cacheMaxBytes);
            return { artifacts, manifest, cache: { ...cache.stats } };
        }
        catch (error) {
            if (earlyWork !== null) {
                early.abort();
                await earlyWork.catch(() => undefined);
            }
            throw toLightkilnError(progressFailure() ?? error);
        }
    }
    /**
     * Builds every artifact row: phase 1 side by side (the DFG table and the irradiance do not wait for the
     * specular chain; their pool jobs fill the threads the chain's last tiles leave idle), settled before
     * failing so no pool work outlives the bake; then phase 2 (views, contact sheet) in table order.
     */
    async #buildArtifacts(run, recipe, keys) {
        const rows = artifactRows(recipe, keys);
        const results = {};
        const build = (row) => run.file(row.key, () => row.build(run, results));
        const first = rows.filter((row) => row.phase === 1);
        const settled = await Promise.allSettled(first.map(build));
        const files = [];
        settled.forEach((outcome, i) => {
            if (outcome.status === 'rejected')
                throw outcome.reason;
            files.push({ row: first[i], file: outcome.value });
            Object.assign(results, { [first[i].kind]: outcome.value });
        });
        for (const row of rows.filter((r) => r.phase === 2))
            files.push({ row, file: await build(row) });
        return { files, results };
    }
    /**
     * Bakes the DFG lookup table alone (it does not depend on any input) as a KTX 2.0 file, through the
     * same cache as the probes.
     */
    async lut(options = {}, run = {}) {
        let progressFailure = () => undefined;
        try {
            if (this.#closed)
                throw new LightkilnError('INVALID_OPTION', 'the baker is closed');
            const { dfg, supercompression } = resolveLutOptions(options);
            const keys = lutKeys(dfg, supercompression);
            const cache = new EntryCache(this.#store);
            const guarded = guardedContext(this.#pool, run, this.#options.targetTileCost);
            progressFailure = guarded.failure;
            const ctx = guarded.ctx;
            const file = await cachedFile(cache, keys.lutFile, async () => {
                const table = await cachedDfg(cache, keys.dfg, dfg, ctx);
                if (supercompression === 'zstd')
                    await initZstd();
                return { bytes: encodeDfgKtx2(table, supercompression, dfg.samples), meta: { channels: [...table.channelNames] } };
            }, () => {
                if (ctx.signal?.aborted)
                    throw aborted(ctx.signal.reason);
            });
            return { kind: 'lut', name: 'dfg.ktx2', path: null, format: file.meta.channels.length === 2 ? 'ktx2/rg16f' : 'ktx2/rgba16f', bytes: file.bytes, sha256: sha256Hex(file.bytes), fromCache: file.fromCache };
        }
        catch (error) {
            throw toLightkilnError(progressFailure() ?? error);
        }
    }
    /** Ends the baker; closes its pool when it made one (the shared pool stays for other bakers). */
    async close() {
        if (this.#closed)
            return;
        this.#closed = true;
        if (this.#ownsPool)
            await this.#pool.close();
    }
}
function isStore(value) {
    if (typeof value !== 'object' || value === null)
        return false;
    const v = value;
    return ['has', 'get', 'put', 'delete', 'entries'].every((m) => typeof v[m] === 'function');
}
/** A baker bound to the shared pool and a cache. */
export function createBaker(options = {}) {
    return new Baker(options);
}
export { MemoryStore, FolderStore, STAGE_VERSIONS };
/** The recipe's input files, their SHA-256 and the bake's cache keys. */
async function readAndHash(recipe, raw) {
    const inputs = await readInputFiles(recipe, raw);
    const inputHashes = [];
    for (const input of inputs)
        inputHashes.push(await sha256HexYielding(input.bytes));
    const inputHash = inputs.length === 1 ? inputHashes[0] : sha256Hex(new TextEncoder().encode(inputHashes.join(',')));
    return { inputs, inputHashes, keys: computeKeys(recipe, inputHash) };
}
//# sourceMappingURL=bake.js.map