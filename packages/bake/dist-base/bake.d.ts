/**
 * The async API: createBaker(options) -> Baker with bake(recipe), plan(recipe), lut() and close(). A bake
 * runs the stages lazily behind the content-hash cache: every artifact and intermediate has a key derived
 * from the input bytes, the recipe fields it depends on and its algorithm version, so an unchanged rebake
 * reads only the finished artifacts and a changed option recomputes only what depends on it. What a bake
 * makes is data (tables.ts): the stage and artifact tables that bake and plan both walk.
 */
import type { BakedArtifact, BakePlan, BakeResult, BakerOptions, BakeRunOptions, LutOptions } from './api.js';
import { FolderStore, MemoryStore, type CacheStore } from './cache/store.js';
import { STAGE_VERSIONS } from './keys.js';
import { type Recipe } from './recipe.js';
import { type BakeProgress } from './stages/context.js';
export type { ArtifactKind, BakedArtifact, BakePlan, BakeResult, BakerOptions, BakeRunOptions, LutOptions, PlanItem } from './api.js';
export declare class Baker {
    #private;
    constructor(options?: BakerOptions);
    get threads(): number;
    get store(): CacheStore | null;
    /** Reports what a bake of this recipe would read from the cache and what it would compute. */
    plan(raw: Recipe): Promise<BakePlan>;
    /** Bakes every artifact of a recipe; with outDir, writes them atomically (nothing is written on failure). */
    bake(raw: Recipe, options?: BakeRunOptions): Promise<BakeResult>;
    /**
     * Bakes the DFG lookup table alone (it does not depend on any input) as a KTX 2.0 file, through the
     * same cache as the probes.
     */
    lut(options?: LutOptions, run?: {
        readonly signal?: AbortSignal;
        readonly onProgress?: (p: BakeProgress) => void;
    }): Promise<BakedArtifact>;
    /** Ends the baker; closes its pool when it made one (the shared pool stays for other bakers). */
    close(): Promise<void>;
}
/** A baker bound to the shared pool and a cache. */
export declare function createBaker(options?: BakerOptions): Baker;
export { MemoryStore, FolderStore, STAGE_VERSIONS };
//# sourceMappingURL=bake.d.ts.map