/**
 * The async API: createBaker(options) -> Baker with bake(recipe), plan(recipe) and close(). A bake runs the
 * stages lazily behind the content-hash cache: every artifact and intermediate has a key derived from the
 * input bytes, the recipe fields it depends on and its algorithm version, so an unchanged rebake reads
 * only the finished artifacts and a changed option recomputes only what depends on it.
 */

import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { decodeKtx2, initZstd, encodeExr, encodeHdr } from '@lightkiln/codecs';
import { getSharedPool, WorkerPool } from '@lightkiln/pool';
import { EntryCache, type CacheStats } from './cache/entry.js';
import { HttpStore, LayeredStore } from './cache/remote.js';
import { FolderStore, MemoryStore, pruneStore, type CacheStore } from './cache/store.js';
import { aborted, invalidOption, LightkilnError, toLightkilnError } from './errors.js';
import type { BakeEvent } from './events.js';
import { sha256Hex } from './hash.js';
import { computeKeys, keyLabels, STAGE_VERSIONS, type Keys } from './keys.js';
import { CONVENTIONS, MANIFEST_SCHEMA_VERSION, shTriples, TOOL_NAME, TOOL_VERSION, type Manifest, type ManifestArtifact, type ManifestLevel } from './manifest.js';
import { renderContactSheet } from './preview/sheet.js';
import { resolveRecipe, roughnessToLodFormula, type Recipe, type ResolvedRecipe } from './recipe.js';
import { BakeRun, encodeTimed } from './run.js';
import { guardedContext, type BakeProgress } from './stages/context.js';
import { cubeCross, encodeCubeKtx2, encodeDfgKtx2 } from './stages/encode.js';
import type { InputFile, SanitizeCounts } from './stages/source.js';
import { checkOutputFolder, writeAtomically } from './write.js';

export interface BakerOptions {
  /** Worker threads; default the machine's available parallelism; 0 runs inline. Range 0..256. */
  readonly threads?: number;
  /** An explicit pool (overrides threads); the baker does not close it. */
  readonly pool?: WorkerPool;
  /**
   * Cache: a folder path, a CacheStore, or false for none. Default: the folder ".lightkiln-cache" in
   * the current directory.
   */
  readonly cache?: string | CacheStore | false;
  /**
   * A shared cache server (HTTP build-cache protocol, cache/remote.ts) behind the local cache folder:
   * read-through, write-through, degrading to local with one warning when it fails. Credentials in the
   * URL or LIGHTKILN_REMOTE_CACHE_TOKEN.
   */
  readonly remoteCache?: string;
  /** Milliseconds per remote request before the remote counts as down. Default 10 000. */
  readonly remoteTimeoutMs?: number;
  /** Receives warnings (a remote cache switched off). Default: process.emitWarning. */
  readonly onWarning?: (message: string) => void;
  /** Least-recently-used eviction after each bake down to this many bytes; default unlimited. */
  readonly cacheMaxBytes?: number;
  /** Cost units (texels x samples) per pool tile; default 200 000. */
  readonly targetTileCost?: number;
}

export interface BakeRunOptions {
  /** Write the artifacts here (created if missing); without it the bake only returns them. */
  readonly outDir?: string;
  readonly signal?: AbortSignal;
  readonly onProgress?: (progress: BakeProgress) => void;
  /** Structured events: stages started and finished, progress, cache hits and misses, artifacts (events.ts). */
  readonly onEvent?: (event: BakeEvent) => void;
}

export type ArtifactKind = 'specular' | 'irradiance' | 'lut' | 'view' | 'preview' | 'manifest';

export interface BakedArtifact {
  readonly kind: ArtifactKind;
  /** File name inside the output folder. */
  readonly name: string;
  /** Full path when written (outDir given), else null. */
  readonly path: string | null;
  readonly format: string;
  readonly bytes: Uint8Array;
  readonly sha256: string;
  readonly fromCache: boolean;
}

export interface BakeResult {
  readonly artifacts: readonly BakedArtifact[];
  readonly manifest: Manifest;
  readonly cache: CacheStats;
}

export interface LutOptions {
  /** Table size (square), 8..1024. Default 128. */
  readonly size?: number;
  /** Samples per texel, 16..65536. Default 1024. */
  readonly samples?: number;
  readonly multiscatter?: boolean;
  readonly cloth?: boolean;
  readonly supercompression?: 'none' | 'zlib' | 'zstd';
}

export interface PlanItem {
  readonly kind: string;
  readonly key: string;
  readonly cached: boolean;
  /** True when a bake would compute (not read) this item. */
  readonly willCompute: boolean;
}

export interface BakePlan {
  readonly probe: string;
  readonly upToDate: boolean;
  readonly artifacts: readonly (PlanItem & { readonly name: string })[];
  readonly stages: readonly PlanItem[];
}

interface SpecularMeta { levels: ManifestLevel[]; sanitized: SanitizeCounts; clamped: number }
interface IrradianceMeta { radiance: number[]; irradiance: number[]; clamped: number }

export class Baker {
  readonly #pool: WorkerPool;
  readonly #ownsPool: boolean;
  readonly #store: CacheStore | null;
  readonly #options: BakerOptions;
  #closed = false;

  constructor(options: BakerOptions = {}) {
    if (options.threads !== undefined && (!Number.isInteger(options.threads) || options.threads < 0 || options.threads > 256)) {
      throw invalidOption('threads', 'must be an integer in 0..256', options.threads);
    }
    if (options.cacheMaxBytes !== undefined && !(options.cacheMaxBytes >= 0)) throw invalidOption('cacheMaxBytes', 'must be a number >= 0', options.cacheMaxBytes);
    if (options.targetTileCost !== undefined && !(options.targetTileCost >= 1)) throw invalidOption('targetTileCost', 'must be a number >= 1', options.targetTileCost);
    this.#options = options;
    if (options.pool !== undefined) {
      this.#pool = options.pool;
      this.#ownsPool = false;
    } else if (options.threads === 0) {
      this.#pool = new WorkerPool({ threads: 0 });
      this.#ownsPool = true;
    } else {
      this.#pool = getSharedPool(options.threads === undefined ? {} : { threads: options.threads });
      this.#ownsPool = false;
    }
    const cache = options.cache ?? '.lightkiln-cache';
    if (cache !== false && typeof cache !== 'string' && !isStore(cache)) throw invalidOption('cache', 'must be a folder path, a CacheStore or false', cache);
    if (cache === '') throw invalidOption('cache', 'must be a non-empty folder path', cache);
    const base = cache === false ? null : typeof cache === 'string' ? new FolderStore(cache) : cache;
    if (options.remoteCache !== undefined) {
      if (typeof options.remoteCache !== 'string') throw invalidOption('remoteCache', 'must be an http(s) URL', typeof options.remoteCache);
      if (base === null) throw invalidOption('remoteCache', 'needs a local cache (cache is false)', options.remoteCache);
      let remote: HttpStore;
      try {
        remote = new HttpStore(options.remoteCache, { ...(options.remoteTimeoutMs !== undefined ? { timeoutMs: options.remoteTimeoutMs } : {}) });
      } catch (error) {
        throw new LightkilnError('INVALID_OPTION', `option "remoteCache": ${error instanceof Error ? error.message : String(error)}`);
      }
      this.#store = new LayeredStore(base, remote, { ...(options.onWarning !== undefined ? { onWarning: options.onWarning } : {}) });
    } else {
      this.#store = base;
    }
  }

  get threads(): number {
    return this.#pool.threads;
  }

  get store(): CacheStore | null {
    return this.#store;
  }

  #readInputs(recipe: ResolvedRecipe, raw: Recipe): InputFile[] {
    if (raw.input.bytes !== undefined) {
      if (raw.input.bytes.length > recipe.limits.maxInputBytes) throw new LightkilnError('LIMIT_EXCEEDED', `${recipe.input.name}: input of ${raw.input.bytes.length} bytes exceeds limits.maxInputBytes (${recipe.limits.maxInputBytes})`, { file: recipe.input.name });
      return [{ name: recipe.input.name, bytes: raw.input.bytes }];
    }
    const paths = recipe.input.faces ?? [recipe.input.path!];
    return paths.map((path) => {
      let size: number;
      try {
        const st = statSync(path);
        if (!st.isFile()) throw new LightkilnError('INVALID_INPUT', `${path}: not a regular file`, { file: path });
        size = st.size;
      } catch (error) {
        throw toLightkilnError(error, path);
      }
      if (size > recipe.limits.maxInputBytes) throw new LightkilnError('LIMIT_EXCEEDED', `${path}: file of ${size} bytes exceeds limits.maxInputBytes (${recipe.limits.maxInputBytes})`, { file: path });
      try {
        const b = readFileSync(path);
        return { name: path, bytes: new Uint8Array(b.buffer, b.byteOffset, b.byteLength) };
      } catch (error) {
        throw toLightkilnError(error, path);
      }
    });
  }

  #prepare(raw: Recipe): { recipe: ResolvedRecipe; inputs: InputFile[]; inputHashes: string[]; keys: Keys } {
    if (this.#closed) throw new LightkilnError('INVALID_OPTION', 'the baker is closed');
    const recipe = resolveRecipe(raw);
    const inputs = this.#readInputs(recipe, raw);
    const inputHashes = inputs.map((i) => sha256Hex(i.bytes));
    const inputHash = inputs.length === 1 ? inputHashes[0]! : sha256Hex(new TextEncoder().encode(inputHashes.join(',')));
    return { recipe, inputs, inputHashes, keys: computeKeys(recipe, inputHash) };
  }

  /** Reports what a bake of this recipe would read from the cache and what it would compute. */
  async plan(raw: Recipe): Promise<BakePlan> {
    const { recipe, keys } = this.#prepare(raw);
    const cache = new EntryCache(this.#store);
    const has = async (key: string): Promise<boolean> => cache.has(key);
    const files: { kind: string; name: string; key: string }[] = [
      { kind: 'specular', name: `${recipe.name}.specular.ktx2`, key: keys.specularFile },
      { kind: 'irradiance', name: `${recipe.name}.irradiance.ktx2`, key: keys.irradianceFile },
      ...(recipe.dfg.enabled ? [{ kind: 'lut', name: `${recipe.name}.dfg.ktx2`, key: keys.lutFile }] : []),
      ...keys.views.map((v) => ({ kind: 'view', name: v.name, key: v.key })),
      ...(recipe.output.preview ? [{ kind: 'preview', name: `${recipe.name}.preview.png`, key: keys.preview }] : []),
    ];
    const artifacts = await Promise.all(files.map(async (f) => ({ ...f, cached: await has(f.key), willCompute: false })));
    const need = (kind: string): boolean => artifacts.some((a) => !a.cached && (a.kind === kind || ((kind === 'irradiance' || kind === 'specular') && (a.kind === 'view' || a.kind === 'preview')) || (kind === 'lut' && a.kind === 'preview')));
    const levelItems = await Promise.all(keys.levels.map(async (key, m) => ({ kind: `level ${m}`, key, cached: await has(key), willCompute: false })));
    const levelsComputed = need('specular') ? levelItems.map((l) => ({ ...l, willCompute: !l.cached })) : levelItems;
    const shItem = { kind: 'sh', key: keys.sh, cached: await has(keys.sh), willCompute: false };
    const irrItem = { kind: 'irradiance cube', key: keys.irradianceCube, cached: await has(keys.irradianceCube), willCompute: false };
    const shC = need('irradiance') && !shItem.cached;
    const irrC = need('irradiance') && !irrItem.cached;
    const dfgItem = { kind: 'dfg', key: keys.dfg, cached: await has(keys.dfg), willCompute: false };
    const dfgC = recipe.dfg.enabled && need('lut') && !dfgItem.cached;
    const pyramidItem = { kind: 'pyramid', key: keys.pyramid, cached: await has(keys.pyramid), willCompute: false };
    const pyrC = !pyramidItem.cached && (levelsComputed.some((l) => l.willCompute) || shC || irrC);
    const sourceItem = { kind: 'source', key: keys.source, cached: await has(keys.source), willCompute: false };
    const srcC = pyrC && !sourceItem.cached;
    const stages = [
      { ...sourceItem, willCompute: srcC }, { ...pyramidItem, willCompute: pyrC }, ...levelsComputed,
      { ...shItem, willCompute: shC }, { ...irrItem, willCompute: irrC }, { ...dfgItem, willCompute: dfgC },
    ];
    return {
      probe: recipe.name,
      upToDate: artifacts.every((a) => a.cached),
      artifacts: artifacts.map((a) => ({ ...a, willCompute: !a.cached })),
      stages,
    };
  }

  /** Bakes every artifact of a recipe; with outDir, writes them atomically (nothing is written on failure). */
  async bake(raw: Recipe, options: BakeRunOptions = {}): Promise<BakeResult> {
    const started = performance.now();
    let progressFailure = (): unknown => undefined;
    try {
      if (typeof options !== 'object' || options === null) throw invalidOption('bake options', 'must be an object', options);
      if (options.signal?.aborted) throw aborted(options.signal.reason);
      const { recipe, inputs, inputHashes, keys } = this.#prepare(raw);
      const outDir = options.outDir;
      if (outDir !== undefined && (typeof outDir !== 'string' || outDir === '')) throw invalidOption('outDir', 'must be a non-empty folder path', outDir);
      if (outDir !== undefined) checkOutputFolder(outDir, recipe.name);
      const cache = new EntryCache(this.#store);
      const guarded = guardedContext(this.#pool, options, this.#options.targetTileCost);
      progressFailure = guarded.failure;
      const ctx = guarded.ctx;
      const run = new BakeRun(recipe, inputs, keys, cache, ctx);
      const emit = guarded.emit;
      run.emit = emit;
      const labels = keyLabels(keys);
      cache.onAccess = (key, hit) => emit({ type: 'cache', entry: labels.get(key) ?? key, hit });
      const r = recipe;
      const roughnessList = JSON.stringify(r.roughness);
      // The three files run side by side: the DFG table and the irradiance do not wait for the specular
      // chain, and their pool jobs fill the threads the chain's last tiles leave idle.
      const specularP = run.file<SpecularMeta>(keys.specularFile, async () => {
        const levels = await run.levels();
        const { sanitized } = await run.pyramid();
        const { bytes, clamped } = await encodeTimed(run, () => encodeCubeKtx2(levels.map((l) => l.data), r.size, r.output.specularFormat, r.output.supercompression, {
          'lightkiln.content': 'prefiltered radiance (GGX, split sum, n = v = r)',
          'lightkiln.roughness': roughnessList,
          'lightkiln.roughnessToLod': roughnessToLodFormula(r.roughness),
          'lightkiln.samples': JSON.stringify(r.samples),
        }));
        return {
          bytes,
          meta: {
            sanitized,
            clamped,
            levels: levels.map((l) => ({ level: l.level, size: l.size, roughness: r.roughness[l.level]!, samples: l.level === 0 ? 0 : r.samples[l.level]!, usedSamples: l.level === 0 ? 0 : l.usedSamples, relativeErrorEstimate: l.relativeErrorEstimate })),
          },
        };
      });
      const irradianceP = run.file<IrradianceMeta>(keys.irradianceFile, async () => {
        const sh = await run.sh();
        const cube = await run.irradianceCube();
        const { bytes, clamped } = await encodeTimed(run, () => encodeCubeKtx2([cube], r.irradiance.cubeSize, r.output.irradianceFormat, r.output.supercompression, {
          'lightkiln.content': 'irradiance E(n) (not E / pi)',
          'lightkiln.source': r.irradiance.cubeSource,
        }));
        return { bytes, meta: { radiance: [...sh.radiance], irradiance: [...sh.irradiance], clamped } };
      });
      const lutP = r.dfg.enabled ? run.file<{ channels: string[] }>(keys.lutFile, async () => {
        const table = await run.dfg();
        return { bytes: await encodeTimed(run, () => encodeDfgKtx2(table, r.output.supercompression, r.dfg.samples)), meta: { channels: [...table.channelNames] } };
      }) : Promise.resolve(null);
      // Settle all three before failing, so no pool work of this bake outlives it.
      const settled = await Promise.allSettled([specularP, irradianceP, lutP]);
      for (const outcome of settled) if (outcome.status === 'rejected') throw outcome.reason;
      const specular = await specularP;
      const irradiance = await irradianceP;
      const lut = await lutP;
      const views = [];
      for (const view of keys.views) {
        views.push({ view, file: await run.file<Record<string, never>>(view.key, async () => {
          const data = view.kind === 'mirror' ? (await run.levels())[0]!.data : await run.irradianceCube();
          const image = cubeCross(data, view.kind === 'mirror' ? r.size : r.irradiance.cubeSize);
          return { bytes: view.format === 'hdr' ? encodeHdr(image) : encodeExr(image, { pixelType: 'half', compression: 'zip' }), meta: {} };
        }) });
      }
      const preview = r.output.preview ? await run.file<Record<string, never>>(keys.preview, async () => ({
        bytes: renderContactSheet({
          probe: r.name, roughness: r.roughness,
          specular: decodeKtx2(specular.bytes), irradiance: decodeKtx2(irradiance.bytes), lut: lut === null ? null : decodeKtx2(lut.bytes),
        }),
        meta: {},
      })) : null;
      if (options.signal?.aborted) throw aborted(options.signal.reason);
      const artifacts: BakedArtifact[] = [];
      const add = (kind: ArtifactKind, name: string, format: string, file: { bytes: Uint8Array; fromCache: boolean }): void => {
        artifacts.push({ kind, name, path: outDir === undefined ? null : join(outDir, name), format, bytes: file.bytes, sha256: sha256Hex(file.bytes), fromCache: file.fromCache });
      };
      add('specular', `${r.name}.specular.ktx2`, `ktx2/${r.output.specularFormat}`, specular);
      add('irradiance', `${r.name}.irradiance.ktx2`, `ktx2/${r.output.irradianceFormat}`, irradiance);
      if (lut !== null) add('lut', `${r.name}.dfg.ktx2`, lut.meta.channels.length === 2 ? 'ktx2/rg16f' : 'ktx2/rgba16f', lut);
      for (const { view, file } of views) add('view', view.name, view.format, file);
      if (preview !== null) add('preview', `${r.name}.preview.png`, 'png', preview);
      const manifestArtifacts: ManifestArtifact[] = artifacts.map((a) => ({ kind: a.kind as ManifestArtifact['kind'], path: a.name, format: a.format, byteLength: a.bytes.length, sha256: a.sha256 }));
      run.timings.total = performance.now() - started;
      const manifest: Manifest = {
        schemaVersion: MANIFEST_SCHEMA_VERSION,
        tool: { name: TOOL_NAME, version: TOOL_VERSION },
        probe: r.name,
        inputs: inputs.map((i, k) => ({ path: i.name, byteLength: i.bytes.length, sha256: inputHashes[k]! })),
        recipe: r,
        conventions: CONVENTIONS,
        roughnessToLod: roughnessToLodFormula(r.roughness),
        levels: specular.meta.levels,
        sh: {
          basis: 'real SH9, order (Y00, Y1-1 y, Y10 z, Y11 x, Y2-2 xy, Y2-1 yz, Y20 3z^2-1, Y21 xz, Y22 x^2-y^2), no Condon-Shortley phase',
          window: { kind: r.irradiance.shWindow, width: r.irradiance.shWindowWidth },
          radiance: shTriples(irradiance.meta.radiance),
          irradiance: shTriples(irradiance.meta.irradiance),
        },
        irradianceCube: { size: r.irradiance.cubeSize, source: r.irradiance.cubeSource, stores: 'E (irradiance), not E / pi' },
        lut: lut === null ? null : { size: r.dfg.size, samples: r.dfg.samples, channels: lut.meta.channels },
        artifacts: manifestArtifacts,
        sanitized: specular.meta.sanitized,
        clampedToFormat: { specular: specular.meta.clamped, irradiance: irradiance.meta.clamped },
        timingsMs: Object.fromEntries(Object.entries(run.timings).map(([k, v]) => [k, Math.round(v * 10) / 10])),
        cache: { ...cache.stats },
      };
      const manifestBytes = new TextEncoder().encode(`${JSON.stringify(manifest, null, 2)}\n`);
      add('manifest', `${r.name}.probe.json`, 'json', { bytes: manifestBytes, fromCache: false });
      const kept = outDir !== undefined ? writeAtomically(outDir, artifacts) : new Set<string>();
      for (const a of artifacts) emit({ type: 'artifact', kind: a.kind, name: a.name, path: a.path, sha256: a.sha256, bytes: a.bytes.length, written: outDir !== undefined && !kept.has(a.name), fromCache: a.fromCache });
      if (this.#store !== null && this.#options.cacheMaxBytes !== undefined) await pruneStore(this.#store, this.#options.cacheMaxBytes);
      return { artifacts, manifest, cache: { ...cache.stats } };
    } catch (error) {
      throw toLightkilnError(progressFailure() ?? error);
    }
  }

  /**
   * Bakes the DFG lookup table alone (it does not depend on any input) as a KTX 2.0 file, through the
   * same cache as the probes.
   */
  async lut(options: LutOptions = {}, run: { readonly signal?: AbortSignal; readonly onProgress?: (p: BakeProgress) => void } = {}): Promise<BakedArtifact> {
    let progressFailure = (): unknown => undefined;
    try {
      if (this.#closed) throw new LightkilnError('INVALID_OPTION', 'the baker is closed');
      const resolved = resolveRecipe({ input: { bytes: new Uint8Array(1), name: 'lut' }, dfg: { enabled: true, ...(options.size !== undefined ? { size: options.size } : {}), ...(options.samples !== undefined ? { samples: options.samples } : {}), ...(options.multiscatter !== undefined ? { multiscatter: options.multiscatter } : {}), ...(options.cloth !== undefined ? { cloth: options.cloth } : {}) }, output: { supercompression: options.supercompression ?? 'none' } });
      const keys = computeKeys(resolved, '0'.repeat(64));
      const cache = new EntryCache(this.#store);
      const guarded = guardedContext(this.#pool, run, this.#options.targetTileCost);
      progressFailure = guarded.failure;
      const ctx = guarded.ctx;
      const bakeRun = new BakeRun(resolved, [], keys, cache, ctx);
      const file = await bakeRun.file<{ channels: string[] }>(keys.lutFile, async () => {
        const table = await bakeRun.dfg();
        if (resolved.output.supercompression === 'zstd') await initZstd();
        return { bytes: encodeDfgKtx2(table, resolved.output.supercompression, resolved.dfg.samples), meta: { channels: [...table.channelNames] } };
      });
      return { kind: 'lut', name: 'dfg.ktx2', path: null, format: file.meta.channels.length === 2 ? 'ktx2/rg16f' : 'ktx2/rgba16f', bytes: file.bytes, sha256: sha256Hex(file.bytes), fromCache: file.fromCache };
    } catch (error) {
      throw toLightkilnError(progressFailure() ?? error);
    }
  }

  /** Ends the baker; closes its pool when it made one (the shared pool stays for other bakers). */
  async close(): Promise<void> {
    if (this.#closed) return;
    this.#closed = true;
    if (this.#ownsPool) await this.#pool.close();
  }
}

function isStore(value: unknown): value is CacheStore {
  if (typeof value !== 'object' || value === null) return false;
  const v = value as Record<string, unknown>;
  return ['has', 'get', 'put', 'delete', 'entries'].every((m) => typeof v[m] === 'function');
}

/** A baker bound to the shared pool and a cache. */
export function createBaker(options: BakerOptions = {}): Baker {
  return new Baker(options);
}

export { MemoryStore, FolderStore, STAGE_VERSIONS };
