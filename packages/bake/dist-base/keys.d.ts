/**
 * Cache keys of a bake: every stage and every file has a key, the SHA-256 of its name, its algorithm
 * version and exactly the inputs it depends on (hash.ts), so a changed option recomputes only what
 * depends on it.
 */
import { type ResolvedRecipe } from './recipe.js';
export { STAGE_VERSIONS } from './version.js';
export interface Keys {
    readonly inputHash: string;
    readonly source: string;
    readonly pyramid: string;
    readonly levels: readonly string[];
    readonly sh: string;
    readonly irradianceCube: string;
    readonly dfg: string;
    readonly specularFile: string;
    readonly irradianceFile: string;
    readonly lutFile: string;
    readonly views: readonly {
        name: string;
        key: string;
        kind: 'mirror' | 'irradiance';
        format: 'hdr' | 'exr';
    }[];
    readonly preview: string;
}
/** Keys of the DFG table and its file: they depend on the table's options only (no input). */
export declare function lutKeys(options: ResolvedRecipe['dfg'], supercompression: ResolvedRecipe['output']['supercompression']): {
    dfg: string;
    lutFile: string;
};
export declare function computeKeys(recipe: ResolvedRecipe, inputHash: string): Keys;
//# sourceMappingURL=keys.d.ts.map