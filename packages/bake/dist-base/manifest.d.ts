/** The `<probe>.probe.json` manifest (the repo README, "The library"): everything a consumer needs without the code. */
import { type ResolvedRecipe } from './recipe.js';
import type { InputFile, SanitizeCounts } from './stages/source.js';
export declare const MANIFEST_SCHEMA_VERSION = 1;
export { TOOL_NAME, TOOL_VERSION } from './version.js';
export interface ManifestLevel {
    readonly level: number;
    readonly size: number;
    readonly roughness: number;
    /** Samples per texel requested, and those with n.l > 0 actually used (source texels for reference). */
    readonly samples: number;
    readonly usedSamples: number;
    /**
     * Estimated RMS over texels of the relative error in BT.709 luminance (each texel's error over its own
     * luminance; 0 = exact at this level). See the bake README for how each method estimates it.
     */
    readonly relativeErrorEstimate: number;
}
export interface ManifestArtifact {
    readonly kind: 'specular' | 'irradiance' | 'lut' | 'view' | 'preview';
    readonly path: string;
    readonly format: string;
    readonly byteLength: number;
    readonly sha256: string;
}
export interface Manifest {
    readonly schemaVersion: number;
    readonly tool: {
        readonly name: string;
        readonly version: string;
    };
    readonly probe: string;
    readonly inputs: readonly {
        readonly path: string;
        readonly byteLength: number;
        readonly sha256: string;
    }[];
    readonly recipe: Omit<ResolvedRecipe, 'input'> & {
        readonly input: {
            readonly path: string | null;
            readonly name: string;
            readonly layout: string;
            readonly faces: readonly string[] | null;
        };
    };
    readonly conventions: Readonly<Record<string, string>>;
    /**
     * The level of detail a shader samples the specular chain at for perceptual roughness r, as a formula
     * to copy, e.g. "lod = (L - 1) * pow(r, 0.8), L = 6" (textureLod(cube, R, lod)).
     */
    readonly roughnessToLod: string;
    readonly levels: readonly ManifestLevel[];
    readonly sh: {
        readonly basis: string;
        readonly window: {
            readonly kind: string;
            readonly width: number;
        };
        readonly radiance: readonly (readonly [number, number, number])[];
        readonly irradiance: readonly (readonly [number, number, number])[];
    };
    readonly irradianceCube: {
        readonly size: number;
        readonly source: string;
        readonly stores: string;
    };
    readonly lut: {
        readonly size: number;
        readonly samples: number;
        readonly channels: readonly string[];
    } | null;
    readonly artifacts: readonly ManifestArtifact[];
    readonly sanitized: SanitizeCounts;
    /** Texels of each written cube clamped to the largest finite value of its format (never Inf in a file). */
    readonly clampedToFormat: {
        readonly specular: number;
        readonly irradiance: number;
    };
    readonly timingsMs: Readonly<Record<string, number>>;
    readonly cache: {
        readonly hits: number;
        readonly misses: number;
        readonly corrupt: number;
        readonly writes: number;
    };
}
export declare const CONVENTIONS: Readonly<Record<string, string>>;
/** SH coefficients as 9 [r, g, b] triples in the order of the manifest's `sh.basis`. */
export declare function shTriples(coeffs: ArrayLike<number>): [number, number, number][];
/** What the manifest is assembled from: the bake's recipe and inputs, and the metadata its files carried. */
export interface ManifestParts {
    readonly recipe: ResolvedRecipe;
    readonly inputs: readonly InputFile[];
    readonly inputHashes: readonly string[];
    readonly levels: readonly ManifestLevel[];
    readonly sh: {
        readonly radiance: readonly number[];
        readonly irradiance: readonly number[];
    };
    readonly lutChannels: readonly string[] | null;
    readonly artifacts: readonly ManifestArtifact[];
    readonly sanitized: SanitizeCounts;
    readonly clampedToFormat: {
        readonly specular: number;
        readonly irradiance: number;
    };
    readonly timingsMs: Readonly<Record<string, number>>;
    readonly cache: Manifest['cache'];
}
export declare function assembleManifest(p: ManifestParts): Manifest;
//# sourceMappingURL=manifest.d.ts.map