/**
 * Brute-force convolutions over a source cube level: the `reference` specular mode (ground truth for tests
 * and the sample-budget sweep) and the direct cosine convolution of the irradiance cube. For the latter,
 * buffers.srcDirs holds per source texel (x, y, z, solid angle) as float64 (exact texel solid angles).
 */
import type { SharedBuffers } from '@lightkiln/pool';
export interface ConvolveParams {
    /** Float offset of the source level in buffers.pyramid and its texel count. */
    readonly srcOffset: number;
    readonly srcTexels: number;
    /** Output face size, first item of this output level and float offset in buffers.dst. */
    readonly size: number;
    readonly levelBegin: number;
    readonly dstOffset: number;
}
export interface ReferenceParams {
    /** Face size of the level-0 cube (at float offset 0 of buffers.pyramid). */
    readonly srcSize: number;
    /** Quadrature points per axis inside each level-0 texel near the lobe peak (1..8). */
    readonly subdivision: number;
    /** Texels whose centre lies within this cosine of n (the lobe peak, n = v) get the fine points. */
    readonly cosNear: number;
    readonly size: number;
    readonly levelBegin: number;
    readonly dstOffset: number;
    readonly alpha: number;
}
/**
 * Reference LD(n) with n = v: a deterministic quadrature of
 * integral L(l) D(h) (n.l) dl / integral D(h) (n.l) dl over the whole sphere: one point per level-0
 * texel, or subdivision^2 points in texels near the lobe peak where D changes within a texel; each point
 * weighted by its solid angle (face area element (1 + u^2 + v^2)^(-3/2) du dv) and reading L with the same
 * in-face bilinear fetch as the sampled kernel, so that plain importance sampling converges to it.
 * (n.h)^2 = (1 + n.l) / 2 (half-angle identity); GGX D (Walter et al. 2007; 1/pi cancels in the ratio).
 */
export declare function referenceSpecular(buffers: SharedBuffers, begin: number, end: number, params: ReferenceParams): void;
/**
 * Irradiance E(n) = integral L max(0, n.l) dl (E, not E / pi) as a normalised quadrature:
 * pi * sum_j L_j w_j / sum_j w_j with w_j = max(0, n.l_j) dOmega_j, using integral max(0, n.l) dl = pi,
 * so a constant environment gives exactly pi L despite texels straddling the horizon.
 */
export declare function convolveIrradiance(buffers: SharedBuffers, begin: number, end: number, params: ConvolveParams): void;
//# sourceMappingURL=convolve.d.ts.map