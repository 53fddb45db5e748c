/**
 * Stage 1: decode and sanitise. Produces either an equirectangular RGB image or an RGB cube, with the
 * counts of repaired pixels for the manifest. Policy (recipe.sanitize): NaN -> 0, +Inf and values above
 * maxRadiance -> maxRadiance, -Inf and negatives -> 0, or a typed error when the recipe says 'reject'.
 */
import type { Recipe, ResolvedRecipe } from '../recipe.js';
export interface SanitizeCounts {
    nan: number;
    infinite: number;
    negative: number;
    clampedHigh: number;
}
export type SourceImage = {
    readonly kind: 'equirect';
    readonly width: number;
    readonly height: number;
    readonly data: Float32Array;
    readonly sanitized: SanitizeCounts;
} | {
    readonly kind: 'cube';
    readonly size: number;
    readonly data: Float32Array;
    readonly sanitized: SanitizeCounts;
};
export interface InputFile {
    readonly name: string;
    readonly bytes: Uint8Array;
}
/** The recipe's input files (bytes given, one path, or six faces), each checked against limits.maxInputBytes. */
export declare function readInputFiles(recipe: ResolvedRecipe, raw: Recipe): Promise<InputFile[]>;
/** Repairs or rejects non-finite, negative and too-bright values in place. */
export declare function sanitize(data: Float32Array, recipe: ResolvedRecipe, file: string): SanitizeCounts;
/** Decodes the input(s) of a recipe into a sanitised source. */
export declare function decodeSource(recipe: ResolvedRecipe, inputs: readonly InputFile[]): SourceImage;
//# sourceMappingURL=source.d.ts.map