/**
 * Stage 4: the specular chain. Level 0 is the resampled cube; each level m >= 1 holds LD at its texel
 * centres for roughness r_m, by GGX importance sampling (n = v = r) with NoL weights and, when enabled,
 * filtered importance sampling. A level's sample set is built once here and shared by all its texels.
 */
import { type NodeGeometry } from './node-geometry.js';
import { type StageContext } from './context.js';
import { type Pyramid } from './pyramid.js';
import type { LevelDescriptor } from '../recipe.js';
export interface SampleSetOptions {
    readonly sampleCount: number;
    readonly filtered: boolean;
    readonly lodBias: number;
    /** Seed of the level's Cranley-Patterson rotation; 0 = none. */
    readonly rotationSeed: number;
}
/** A level's sample set: per kept sample (lx, ly, lz, NoL, (1 - f) NoL, f NoL) and (offset0, size0, offset1, size1). */
export interface SampleSet {
    readonly directions: Float64Array;
    readonly levels: Int32Array;
    readonly count: number;
}
/**
 * The sample set of one level: h from the Hammersley
 * point i of N (Walter et al. 2007 GGX sampling), l = 2 (n.h) h - n in the local frame (n = v = z),
 * weight NoL, and for filtered importance sampling the source level
 * lod = max(0.5 log2(Omega_s / Omega_p) + bias, 0), Omega_s = 1 / (N p(l)), p(l) = D(h) / 4 (n = v),
 * Omega_p = 4 pi / (6 w^2) for the level-0 face width w (Krivanek & Colbert 2008, "Real-time Shading with Filtered Importance Sampling", CGF 27(4)).
 * Samples with NoL <= 0 are dropped (they carry no weight).
 */
export declare function buildSampleSet(alpha: number, pyramid: Pyramid, options: SampleSetOptions): SampleSet;
/** A level to compute (level >= 1): the recipe's level descriptor. */
export type LevelRequest = LevelDescriptor;
export interface LevelResult {
    readonly level: number;
    readonly size: number;
    /** RGB float32 texels of the six faces. */
    readonly data: Float32Array;
    /** Samples with NoL > 0 actually used per texel. */
    readonly usedSamples: number;
    /**
     * Estimated RMS over texels of the relative luminance error (each texel's error over its own
     * luminance). Quadrature: twice the RMS relative difference against the same tree at half the opening
     * angle on check rows. Sampled: the RMS of each texel's standard error over its luminance (see
     * kernels/specular.ts; conservative for low-discrepancy samples). 0 for level 0 and reference levels.
     */
    readonly relativeErrorEstimate: number;
}
export interface SpecularOptions {
    readonly filtered: boolean;
    readonly lodBias: number;
    readonly clampLuminance: number;
    readonly rotateSequence: boolean;
    readonly quality: 'quadrature' | 'sampled' | 'reference';
}
/**
 * Opening criterion of the hierarchical quadrature: a node is accepted when its angular radius is below
 * QUADRATURE_THETA times the larger of its chord distance from n and QUADRATURE_GAMMA alpha.
 */
export declare const QUADRATURE_THETA = 0.5;
export declare const QUADRATURE_GAMMA = 2;
/** Nodes whose largest possible share of a texel's lobe integral is below this are not opened. */
export declare const QUADRATURE_NEGLIGIBLE = 0.001;
/**
 * A node whose largest possible share of the lobe integral is s < QUADRATURE_SHARE may be wider: its
 * opening test is scaled by sqrt(s / QUADRATURE_SHARE) (small shares tolerate a coarser weight).
 */
export declare const QUADRATURE_SHARE = 0.1;
/**
 * Nodes brighter than QUADRATURE_BRIGHT times the local mean luminance (a sun, a lamp) are normalised by
 * the exact lobe integral instead of the quadrature's own sum of weights: their light is resolved down
 * to the finest level, so the weight-sum error of the coarse nodes must not scale it.
 */
export declare const QUADRATURE_BRIGHT = 4;
/**
 * Integral over the sphere of w(c) = max(c, 0) / (1 + a^2 + c (a^2 - 1))^2 (the kernel's lobe, up to
 * its constant): 2 pi integral_0^1 w(c) dc, by 8-point Gauss-Legendre on panels geometric towards c = 1.
 */
export declare function lobeIntegral(alphaSquared: number): number;
/**
 * The finest pyramid level the quadrature's tree reaches: level 0, unless the next level's texels are
 * already within the acceptance radius at the peak of the narrowest lobe of the chain (angular radius
 * below QUADRATURE_THETA QUADRATURE_GAMMA alpha), as at 1024 and above with the default roughness
 * spacing; then only light brighter than its surroundings (a sun) would be resolved further, and its
 * luminance centroid and spread stand in for that. Skipping level 0 saves three quarters of the node table.
 * (A pyramid whose base is finer than the output, recipe.ts pyramidBaseSize, is always walked to level 0:
 * that base exists because the output's texels were too coarse for the sharpest lobe.)
 */
export declare function finestNodeLevel(pyramid: Pyramid, geometry: NodeGeometry, narrowestAlpha: number): number;
/** Computes the requested levels (all >= 1) in one pool job, so tiles of all levels interleave. */
export declare function prefilterLevels(pyramid: Pyramid, requests: readonly LevelRequest[], options: SpecularOptions, ctx: StageContext): Promise<LevelResult[]>;
/**
 * Quadrature of the reference for one level: near the lobe peak, points per level-0 texel and axis
 * spaced at most 0.15 of the lobe width (about 2 alpha radians in l) apart (1..8), inside a cone of
 * 5 lobe widths plus two texels around n; one point per texel elsewhere (D varies slowly there).
 */
export declare function referenceQuadrature(alpha: number, srcSize: number): {
    subdivision: number;
    cosNear: number;
};
/** Level 0 of the chain: the resampled cube itself (r = 0 is the mirror). */
/** The mirror level (r = 0): the pyramid level of the output face size (level 0 unless the base is supersampled). */
export declare function mirrorLevel(pyramid: Pyramid, size?: number): LevelResult;
//# sourceMappingURL=specular.d.ts.map