/**
 * Stage 4 kernel: prefiltered radiance LD(n) for one or more levels by GGX importance sampling with
 * n = v = r (split-sum prefilter, Karis 2013), NoL weights, and filtered importance sampling: each sample
 * reads the source pyramid at its own level of detail, trilinearly (bilinear on two levels), so bright
 * small sources are integrated instead of aliased (Krivanek & Colbert 2008, "Real-time Shading with
 * Filtered Importance Sampling", CGF 27(4)). The level's sample set is the same for every texel and is
 * precomputed (see stages/specular.ts): per sample (lx, ly, lz, NoL, (1 - frac) NoL, frac NoL) as float64 and
 * (offset0, size0, offset1, size1) of its two source levels as int32 (integer index math stays integral).
 */
import type { SharedBuffers } from '@lightkiln/pool';
export declare const SPECULAR_SAMPLE_STRIDE = 6;
export declare const SPECULAR_LEVEL_STRIDE = 4;
export interface SpecularParams {
    /** Item index of this level's first texel and the level's face size. */
    readonly levelBegin: number;
    readonly size: number;
    /** Float offset of this level's texels in buffers.dst. */
    readonly dstOffset: number;
    /** First sample (in samples) of this level in buffers.samples, and the count. */
    readonly sampleOffset: number;
    readonly sampleCount: number;
    /** Firefly clamp: sample luminance above this is scaled down to it; 0 disables. */
    readonly clampLuminance: number;
    /** Sum of the weights (NoL) and of their squares over the level's samples (the same for every texel). */
    readonly weightSum: number;
    readonly weightSquareSum: number;
}
/**
 * buffers.pyramid (RGB float64, all levels), buffers.samples (float64), buffers.sampleLevels (int32),
 * buffers.dst (RGB float32),
 * buffers.err (float32, one per item: the standard error of the texel's luminance estimate, by the delta
 * method for the ratio estimator sum(w Y) / sum(w): sqrt(sum w^2 (Y - R)^2) / sum w (Cochran 1977,
 * "Sampling Techniques", 3rd ed., sec. 6.4; from memory). It treats the samples as independent, so for the
 * low-discrepancy set it is a conservative (high) estimate.
 */
export declare function prefilterSpecular(buffers: SharedBuffers, begin: number, end: number, params: SpecularParams): void;
//# sourceMappingURL=specular.d.ts.map