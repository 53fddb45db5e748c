/** One bake's memoised stage getters over the cache (BakeRun), used by Baker.bake and Baker.lut. */
import { initZstd } from '@lightkiln/codecs';
import { toShared } from '@lightkiln/pool';
import { aborted, LightkilnError } from './errors.js';
import { lutKeys } from './keys.js';
import { levelDescriptors, pyramidBaseSize } from './recipe.js';
import { warmPool } from './stages/context.js';
import { bakeDfgTable } from './stages/dfg.js';
import { irradianceCube, projectSh9 } from './stages/irradiance.js';
import { nodeGeometryOnPool } from './stages/node-geometry.js';
import { buildPyramid, pyramidLayout } from './stages/pyramid.js';
import { decodeSource } from './stages/source.js';
import { mirrorLevel, prefilterLevels } from './stages/specular.js';
const SOURCE_RELEASED = Promise.reject(new LightkilnError('BAKE_FAILED', 'internal: the decoded source was read after the pyramid was built'));
SOURCE_RELEASED.catch(() => undefined);
/** Angular size of a source pixel (radians): the larger of an equirect pixel's sides, or a cube texel at its face centre. */
function sourcePixelAngle(source) {
    return source.kind === 'equirect' ? Math.max(Math.PI / source.height, (2 * Math.PI) / source.width) : 2 / source.size;
}
export function toF32(a) {
    if (!(a instanceof Float32Array))
        throw new LightkilnError('BAKE_FAILED', 'cache entry has an unexpected layout');
    return a;
}
/** One bake: memoised stage getters over the cache. */
export class BakeRun {
    recipe;
    cache;
    ctx;
    timings = {};
    #source = null;
    #pyramid = null;
    #levels = null;
    #sh = null;
    #irr = null;
    #inputs = null;
    #keys = null;
    #lut;
    #files = new Map();
    /**
     * A run starts before its input is read (attach() gives it the files and keys): what needs no input,
     * the DFG table, can start first and keep the workers busy while this thread reads and decodes.
     */
    constructor(recipe, cache, ctx) {
        this.recipe = recipe;
        this.cache = cache;
        this.ctx = ctx;
        this.#lut = lutKeys(recipe.dfg, recipe.output.supercompression);
    }
    attach(inputs, keys) {
        this.#inputs = inputs;
        this.#keys = keys;
    }
    get inputs() {
        if (this.#inputs === null)
            throw new LightkilnError('BAKE_FAILED', 'internal: the input was used before it was read');
        return this.#inputs;
    }
    get keys() {
        if (this.#keys === null)
            throw new LightkilnError('BAKE_FAILED', 'internal: a cache key was used before the input was hashed');
        return this.#keys;
    }
    #check() {
        if (this.ctx.signal?.aborted)
            throw aborted(this.ctx.signal.reason);
    }
    /** Structured events (BakeRunOptions.onEvent), already guarded by the caller. */
    emit = () => undefined;
    async #timed(stage, fn) {
        const t0 = performance.now();
        this.emit({ type: 'stage', stage, state: 'started' });
        try {
            return await fn();
        }
        finally {
            const ms = performance.now() - t0;
            this.timings[stage] = (this.timings[stage] ?? 0) + ms;
            this.emit({ type: 'stage', stage, state: 'finished', ms: Math.round(ms * 10) / 10 });
        }
    }
    source() {
        if (this.#source === null) {
            warmPool(this.ctx);
            // The quadrature's node geometry is built on a worker while this thread decodes.
            nodeGeometryOnPool(pyramidBaseSize(this.recipe), this.ctx).catch(() => undefined);
        }
        this.#source ??= this.#timed('decode', async () => {
            const entry = await this.cache.get(this.keys.source);
            if (entry !== null) {
                const meta = entry.meta;
                const data = toF32(entry.arrays[0]);
                return meta.kind === 'equirect'
                    ? { kind: 'equirect', width: meta.width, height: meta.height, data, sanitized: meta.sanitized }
                    : { kind: 'cube', size: meta.size, data, sanitized: meta.sanitized };
            }
            this.#check();
            const source = decodeSource(this.recipe, this.inputs);
            await this.cache.put(this.keys.source, {
                meta: source.kind === 'equirect' ? { kind: 'equirect', width: source.width, height: source.height, sanitized: source.sanitized } : { kind: 'cube', size: source.size, sanitized: source.sanitized },
                arrays: [source.data],
            });
            return source;
        });
        return this.#source;
    }
    pyramid() {
        this.#pyramid ??= (async () => {
            const entry = await this.cache.get(this.keys.pyramid);
            if (entry !== null) {
                const meta = entry.meta;
                const layout = pyramidLayout(meta.base);
                return { pyramid: { sizes: layout.sizes, offsets: layout.offsets, data: toShared(toF32(entry.arrays[0])), centroids: toShared(toF32(entry.arrays[1])) }, sanitized: meta.sanitized };
            }
            const source = await this.source();
            this.#check();
            const base = pyramidBaseSize(this.recipe, sourcePixelAngle(source));
            const pyramid = await this.#timed('resample', () => buildPyramid(source, base, this.recipe.rotationDeg, this.ctx));
            await this.cache.put(this.keys.pyramid, { meta: { sanitized: source.sanitized, base }, arrays: [pyramid.data, pyramid.centroids] });
            // Nothing reads the decoded source after the pyramid (the pyramid is memoised): let it go.
            this.#source = SOURCE_RELEASED;
            return { pyramid, sanitized: source.sanitized };
        })();
        return this.#pyramid;
    }
    levels() {
        this.#levels ??= (async () => {
            const r = this.recipe;
            const results = [];
            for (let m = 0; m < r.levels; m++) {
                const entry = await this.cache.get(this.keys.levels[m]);
                if (entry === null) {
                    results.push(null);
                    continue;
                }
                const meta = entry.meta;
                results.push({ level: m, size: levelDescriptors(r)[m].faceSize, data: toF32(entry.arrays[0]), usedSamples: meta.usedSamples, relativeErrorEstimate: meta.relativeErrorEstimate });
            }
            const missing = results.flatMap((res, m) => (res === null ? [m] : []));
            if (missing.length > 0) {
                const { pyramid } = await this.pyramid();
                this.#check();
                const computed = [];
                if (missing[0] === 0)
                    computed.push(mirrorLevel(pyramid, r.size));
                const descriptors = levelDescriptors(r);
                const requests = missing.filter((m) => m > 0).map((m) => descriptors[m]);
                computed.push(...(await this.#timed('specular', () => prefilterLevels(pyramid, requests, r, this.ctx))));
                for (const level of computed) {
                    results[level.level] = level;
                    await this.cache.put(this.keys.levels[level.level], { meta: { usedSamples: level.usedSamples, relativeErrorEstimate: level.relativeErrorEstimate }, arrays: [level.data] });
                }
            }
            return results;
        })();
        return this.#levels;
    }
    sh() {
        this.#sh ??= (async () => {
            const entry = await this.cache.get(this.keys.sh);
            if (entry !== null) {
                const a = entry.arrays;
                if (!(a[0] instanceof Float64Array) || !(a[1] instanceof Float64Array))
                    throw new LightkilnError('BAKE_FAILED', 'cache entry has an unexpected layout');
                return { radiance: a[0], irradiance: a[1] };
            }
            const { pyramid } = await this.pyramid();
            const sh = await this.#timed('irradiance', () => projectSh9(pyramid, 0, this.recipe.irradiance.shWindow, this.recipe.irradiance.shWindowWidth, this.ctx));
            await this.cache.put(this.keys.sh, { meta: {}, arrays: [sh.radiance, sh.irradiance] });
            return sh;
        })();
        return this.#sh;
    }
    irradianceCube() {
        this.#irr ??= (async () => {
            const entry = await this.cache.get(this.keys.irradianceCube);
            if (entry !== null)
                return toF32(entry.arrays[0]);
            const { pyramid } = await this.pyramid();
            this.#check();
            // The direct convolution runs beside the SH9 projection; only the 'sh9' cube waits for it.
            const cube = await this.#timed('irradiance', () => irradianceCube(pyramid, this.recipe.irradiance.cubeSize, this.recipe.irradiance.cubeSource, () => this.sh(), this.ctx));
            await this.cache.put(this.keys.irradianceCube, { meta: {}, arrays: [cube] });
            return cube;
        })();
        return this.#irr;
    }
    dfg() {
        // The table is often a bake's first pool job (it starts before the input is read): the workers'
        // kernel warm-up goes ahead of it, as it does ahead of decoding.
        return cachedDfg(this.cache, this.#lut.dfg, this.recipe.dfg, this.ctx, (fn) => {
            warmPool(this.ctx);
            return this.#timed('dfg', fn);
        });
    }
    /** A finished file from the cache, or built and stored (once per key and run); `meta` carries manifest fragments. */
    file(key, build) {
        let file = this.#files.get(key);
        if (file === undefined) {
            file = cachedFile(this.cache, key, build, () => this.#check());
            this.#files.set(key, file);
        }
        return file;
    }
}
/** The DFG table from the cache, or computed (on the pool) and stored. */
export async function cachedDfg(cache, key, options, ctx, timed = (fn) => fn()) {
    const entry = await cache.get(key);
    if (entry !== null) {
        const meta = entry.meta;
        return { ...meta, data: toF32(entry.arrays[0]) };
    }
    if (ctx.signal?.aborted)
        throw aborted(ctx.signal.reason);
    const table = await timed(() => bakeDfgTable(options, ctx));
    await cache.put(key, { meta: { size: table.size, channels: table.channels, channelNames: table.channelNames }, arrays: [table.data] });
    return table;
}
/** A finished file from the cache, or built, checked against cancellation and stored. */
export async function cachedFile(cache, key, build, check) {
    const entry = await cache.get(key);
    if (entry !== null && entry.arrays[0] instanceof Uint8Array)
        return { bytes: entry.arrays[0], meta: entry.meta, fromCache: true };
    const built = await build();
    check();
    await cache.put(key, { meta: built.meta, arrays: [built.bytes] });
    return { ...built, fromCache: false };
}
export async function encodeTimed(run, fn) {
    // The Zstandard encoder is WebAssembly, loaded once (a few ms) before its first use.
    if (run.recipe.output.supercompression === 'zstd')
        await initZstd();
    const t0 = performance.now();
    const bytes = fn();
    run.timings.encode = (run.timings.encode ?? 0) + performance.now() - t0;
    return bytes;
}
//# sourceMappingURL=run.js.map