/**
 * The bake recipe: what to bake and how. `Recipe` (every field optional but the input) goes through
 * resolveRecipe() to give `ResolvedRecipe` (every field filled in), validated by a zod schema whose
 * errors name the field path and the rule.
 */
export type SamplePreset = 'draft' | 'default' | 'high';
export type CubeFormat = 'rgba16f' | 'rgba32f' | 'rgb9e5' | 'b10g11r11';
export type ShWindow = 'none' | 'hann' | 'lanczos';
/**
 * Per-level sample counts of the presets, linear in roughness from the first value (r -> 0) to the second
 * (r = 1), rounded to a multiple of 8. 'default' keeps every level within 1% relative RMSE of the
 * reference convolution on the analytic sky of packages/bake/test/accuracy.test.ts (0.64% worst, size 64).
 */
export declare const SAMPLE_PRESETS: Readonly<Record<SamplePreset, readonly [number, number]>>;
export interface RecipeInput {
    /** A file to read (format sniffed from its bytes), or bytes already in memory. */
    readonly path?: string;
    readonly bytes?: Uint8Array;
    /** Name used in messages and the manifest when bytes are given. Default "input". */
    readonly name?: string;
    /** How to read the image: 'auto' (default) treats .hdr/.exr/.pfm as equirectangular, .ktx2 as a cubemap. */
    readonly layout?: 'auto' | 'equirect' | 'cube';
    /** Six face files +X, -X, +Y, -Y, +Z, -Z instead of one input (each a square image). */
    readonly faces?: readonly string[];
}
export interface Recipe {
    readonly input: RecipeInput;
    /** Probe name: the base of every artifact name. Default: the input file name without extension. */
    readonly name?: string;
    /** Rotation about +Y in degrees, right-handed (positive turns +Z towards +X). Default 0. */
    readonly rotationDeg?: number;
    /** Level-0 face size, a power of two in 4..4096. Default 256. Cost grows with size^2. */
    readonly size?: number;
    /** Radiance levels; default log2(size) - 2 (down to 8 x 8 faces, at least 2; see defaultLevelCount). */
    readonly levels?: number;
    /** Perceptual roughness per level, in [0, 1], first 0; default (m / (levels - 1))^1.25. */
    readonly roughness?: readonly number[];
    /** Samples per texel: a preset, one number for every level, or one per level. Default 'default'. */
    readonly samples?: SamplePreset | number | readonly number[];
    /** Filtered importance sampling (source level per sample from its pdf). Default true. */
    readonly filtered?: boolean;
    /**
     * Level-of-detail bias of filtered importance sampling, in levels (Krivanek & Colbert 2008 use 1).
     * Default 0.5: at the default preset, bias 1 blurred levels by 0.6-1.1% RMSE against the reference
     * and 0.5 by 0.3-0.6% (accuracy test sky, size 64); lower bias means more noise from small bright sources.
     */
    readonly lodBias?: number;
    /** Firefly clamp: sample luminance above this is scaled down to it. Default 0 (off). Biased when on. */
    readonly clampLuminance?: number;
    /** Per-level Cranley-Patterson rotation of the Hammersley set (decorrelates levels). Default false. */
    readonly rotateSequence?: boolean;
    /**
     * How the levels r > 0 are computed. 'quadrature' (default): a deterministic hierarchical quadrature over
     * the source pyramid that weights every node where its light is, so a small bright sun is integrated
     * where it is (samples, filtered, lodBias, clampLuminance and rotateSequence do not apply).
     * 'sampled': GGX importance sampling (Monte Carlo, for comparison). 'reference': brute-force
     * convolution over every level-0 texel (small sizes only).
     */
    readonly quality?: 'quadrature' | 'sampled' | 'reference';
    readonly irradiance?: {
        /** SH9 ringing window (Sloan 2008) applied to the manifest's coefficients and SH-built cube. Default 'none'. */
        readonly shWindow?: ShWindow;
        /** Band at which the window reaches zero. Default 3. */
        readonly shWindowWidth?: number;
        /** Irradiance cube face size, power of two 1..256. Default 32. */
        readonly cubeSize?: number;
        /** 'convolution' (default, exact cosine convolution) or 'sh9' (reconstructed from the coefficients). */
        readonly cubeSource?: 'convolution' | 'sh9';
    };
    readonly dfg?: {
        /** Bake the DFG table with the probe. Default true. */
        readonly enabled?: boolean;
        /** Table size (square), 8..1024. Default 128. */
        readonly size?: number;
        /** Samples per texel, 16..65536. Default 1024. */
        readonly samples?: number;
        /** Add E_avg(r) as a third channel (multiple-scattering compensation). Default false. */
        readonly multiscatter?: boolean;
        /** Add the cloth (Charlie sheen) albedo as a fourth channel. Default false. */
        readonly cloth?: boolean;
    };
    readonly output?: {
        readonly specularFormat?: CubeFormat;
        readonly irradianceFormat?: CubeFormat;
        /** KTX 2.0 supercompression: 'zstd' (scheme 2, what web loaders read), 'zlib' (scheme 3) or 'none'. Default 'none'. */
        readonly supercompression?: 'none' | 'zlib' | 'zstd';
        /** Extra inspection files of level 0 and the irradiance cube (horizontal cross). Default none. */
        readonly views?: readonly ('hdr' | 'exr')[];
        /** Write `<name>.preview.png`, the contact sheet (levels, irradiance, shaded spheres, DFG). Default false. */
        readonly preview?: boolean;
    };
    readonly sanitize?: {
        /** NaN and infinite pixels: 'repair' (NaN -> 0, +Inf -> maxRadiance) or 'reject'. Default 'repair'. */
        readonly nonFinite?: 'repair' | 'reject';
        /** Negative channels: 'clamp' to 0 or 'reject'. Default 'clamp'. */
        readonly negative?: 'clamp' | 'reject';
        /**
         * Largest source radiance kept; larger values (and +Inf) become this. Default 1e9: a real sun is far
         * brighter than the binary16 range, and its energy must reach the prefiltered levels; the written
         * files clamp to their format's range on their own (counted in the manifest).
         */
        readonly maxRadiance?: number;
    };
    readonly limits?: {
        /** Largest input file in bytes. Default 1 GiB. */
        readonly maxInputBytes?: number;
        /** Largest input image in pixels. Default 67 108 864. */
        readonly maxInputPixels?: number;
        /** Largest samples per texel of any level. Default 65 536. */
        readonly maxSamples?: number;
        /** Largest output texels times samples (the work estimate) of one bake. Default 2e11. */
        readonly maxWork?: number;
    };
}
export interface ResolvedRecipe {
    readonly input: {
        readonly path: string | null;
        readonly name: string;
        readonly layout: 'auto' | 'equirect' | 'cube';
        readonly faces: readonly string[] | null;
    };
    readonly name: string;
    readonly rotationDeg: number;
    readonly size: number;
    readonly levels: number;
    readonly roughness: readonly number[];
    readonly samples: readonly number[];
    readonly samplePreset: SamplePreset | 'custom';
    readonly filtered: boolean;
    readonly lodBias: number;
    readonly clampLuminance: number;
    readonly rotateSequence: boolean;
    readonly quality: 'quadrature' | 'sampled' | 'reference';
    readonly irradiance: {
        readonly shWindow: ShWindow;
        readonly shWindowWidth: number;
        readonly cubeSize: number;
        readonly cubeSource: 'convolution' | 'sh9';
    };
    readonly dfg: {
        readonly enabled: boolean;
        readonly size: number;
        readonly samples: number;
        readonly multiscatter: boolean;
        readonly cloth: boolean;
    };
    readonly output: {
        readonly specularFormat: CubeFormat;
        readonly irradianceFormat: CubeFormat;
        readonly supercompression: 'none' | 'zlib' | 'zstd';
        readonly views: readonly ('hdr' | 'exr')[];
        readonly preview: boolean;
    };
    readonly sanitize: {
        readonly nonFinite: 'repair' | 'reject';
        readonly negative: 'clamp' | 'reject';
        readonly maxRadiance: number;
    };
    readonly limits: {
        readonly maxInputBytes: number;
        readonly maxInputPixels: number;
        readonly maxSamples: number;
        readonly maxWork: number;
    };
}
/** Artifact base names: letters, digits, '.', '_' and '-', not starting with '.', at most 100 characters. */
export declare const SAFE_NAME: RegExp;
/** Validates a recipe and fills in every default; throws LightkilnError INVALID_RECIPE naming each bad field. */
/**
 * The default chain stops at 8 x 8 faces from size 256 up, at 4 x 4 below: smaller faces cannot hold the
 * rough lobes under bilinear filtering (sampled like a shader, a 1 x 1 last level was 8-12% off at r = 1,
 * a 4 x 4 one 1.2%, an 8 x 8 one 0.3%), while below 256 the extra level keeps the roughness steps small
 * enough for the trilinear blend (at 128, stopping at 8 x 8 left 1.5% at r = 0.3; see
 * packages/bake/test/runtime-sampling.test.ts). At least 2 levels, at most the full chain.
 */
export declare function defaultLevelCount(size: number): number;
/** Exponent of the default roughness spacing: r_m = (m / (L - 1))^ROUGHNESS_EXPONENT. */
export declare const ROUGHNESS_EXPONENT = 1.25;
/**
 * Perceptual roughness of level m of L by default: (m / (L - 1))^1.25, denser at low roughness, where the
 * lobe (alpha = r^2) changes fastest relative to itself. Chosen by the shader-side measure (runtime
 * sampling against the exact convolution) among powers 1 to 2 and smallest faces 4 to 32.
 */
export declare function levelRoughness(m: number, levels: number): number;
/**
 * The roughness-to-LOD mapping a shader uses for a chain, as text: the inverse of levelRoughness for the
 * default spacing, else the piecewise-linear interpolation through (r_m, m).
 */
export declare function roughnessToLodFormula(roughness: readonly number[]): string;
/**
 * One level of the specular chain, made once from the recipe and used by the cache keys, the stages,
 * the manifest and the sweep, so a level's face size, roughness and sample count are derived in one place.
 */
export interface LevelDescriptor {
    readonly level: number;
    /** Face size of the level: the base size halved per level, at least 1. */
    readonly faceSize: number;
    /** Perceptual roughness r of the level (GGX alpha = r^2). */
    readonly perceptualRoughness: number;
    /** Samples per texel the recipe asks for (0 at the mirror level; the default quadrature ignores it). */
    readonly requestedSamples: number;
}
/** The chain's levels; `samples` overrides the recipe's per-level counts (the sweep tries other budgets). */
export declare function levelDescriptors(recipe: Pick<ResolvedRecipe, 'size' | 'roughness' | 'samples'>, samples?: readonly number[]): LevelDescriptor[];
/**
 * Face size of the source pyramid's finest level: the output size, doubled (up to 4 x and 512) while a
 * face-centre texel (2 / size radians) is wider than half the GGX alpha of the sharpest level r > 0, and
 * while the source still resolves it (a texel at least two source pixels wide; `sourcePixelAngle`, radians,
 * unknown before decoding gives the upper bound). The quadrature's finest nodes then stay small against
 * every lobe, so a sun a few texels wide is integrated from its own pieces (measured against the
 * convolution of the image: a 2-degree 1e4 x sun at r = 0.18 on 32 x 32 faces, worst texel 0.29% with
 * 64 x 64 leaves, 0.13% with 128 x 128; a 128 bake takes about 10% longer). The mirror level is the
 * pyramid level of the output size. Defaults from a 2048-wide image: 64 -> 128, 128 -> 256, 256 and up
 * unchanged; quality 'reference' keeps the output size (its cost grows as the base size^4).
 */
export declare function pyramidBaseSize(recipe: Pick<ResolvedRecipe, 'size' | 'roughness' | 'quality'>, sourcePixelAngle?: number): number;
/** The mapping of roughnessToLodFormula as a number: the level of detail for perceptual roughness r. */
export declare function roughnessToLod(r: number, roughness: readonly number[]): number;
/** The DFG table's own options (Baker.lut): validated as the recipe's `dfg` and `output.supercompression`. */
export declare function resolveLutOptions(options: {
    size?: number;
    samples?: number;
    multiscatter?: boolean;
    cloth?: boolean;
    supercompression?: 'none' | 'zlib' | 'zstd';
}): {
    dfg: ResolvedRecipe['dfg'];
    supercompression: ResolvedRecipe['output']['supercompression'];
};
export declare function resolveRecipe(recipe: Recipe): ResolvedRecipe;
//# sourceMappingURL=recipe.d.ts.map