/** One bake's memoised stage getters over the cache (BakeRun), used by Baker.bake and Baker.lut. */
import type { EntryCache } from './cache/entry.js';
import type { BakeEvent } from './events.js';
import { type Keys } from './keys.js';
import { type ResolvedRecipe } from './recipe.js';
import { type StageContext } from './stages/context.js';
import { type DfgTable } from './stages/dfg.js';
import { type ShResult } from './stages/irradiance.js';
import { type Pyramid } from './stages/pyramid.js';
import { type InputFile, type SanitizeCounts, type SourceImage } from './stages/source.js';
import { type LevelResult } from './stages/specular.js';
export declare function toF32(a: unknown): Float32Array;
/** One bake: memoised stage getters over the cache. */
export declare class BakeRun {
    #private;
    readonly recipe: ResolvedRecipe;
    readonly cache: EntryCache;
    readonly ctx: StageContext;
    readonly timings: Record<string, number>;
    /**
     * A run starts before its input is read (attach() gives it the files and keys): what needs no input,
     * the DFG table, can start first and keep the workers busy while this thread reads and decodes.
     */
    constructor(recipe: ResolvedRecipe, cache: EntryCache, ctx: StageContext);
    attach(inputs: readonly InputFile[], keys: Keys): void;
    get inputs(): readonly InputFile[];
    get keys(): Keys;
    /** Structured events (BakeRunOptions.onEvent), already guarded by the caller. */
    emit: (event: BakeEvent) => void;
    source(): Promise<SourceImage>;
    pyramid(): Promise<{
        pyramid: Pyramid;
        sanitized: SanitizeCounts;
    }>;
    levels(): Promise<LevelResult[]>;
    sh(): Promise<ShResult>;
    irradianceCube(): Promise<Float32Array>;
    dfg(): Promise<DfgTable>;
    /** A finished file from the cache, or built and stored (once per key and run); `meta` carries manifest fragments. */
    file<M>(key: string, build: () => Promise<{
        bytes: Uint8Array;
        meta: M;
    }>): Promise<{
        bytes: Uint8Array;
        meta: M;
        fromCache: boolean;
    }>;
}
/** The DFG table from the cache, or computed (on the pool) and stored. */
export declare function cachedDfg(cache: EntryCache, key: string, options: ResolvedRecipe['dfg'], ctx: StageContext, timed?: (fn: () => Promise<DfgTable>) => Promise<DfgTable>): Promise<DfgTable>;
/** A finished file from the cache, or built, checked against cancellation and stored. */
export declare function cachedFile<M>(cache: EntryCache, key: string, build: () => Promise<{
    bytes: Uint8Array;
    meta: M;
}>, check: () => void): Promise<{
    bytes: Uint8Array;
    meta: M;
    fromCache: boolean;
}>;
export declare function encodeTimed<T>(run: BakeRun, fn: () => T): Promise<T>;
//# sourceMappingURL=run.d.ts.map