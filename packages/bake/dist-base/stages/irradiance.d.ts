/**
 * Stage 5: diffuse irradiance. SH9 projection of the level-0 cube with exact texel solid angles
 * (Ramamoorthi & Hanrahan 2001), optional ringing window (Sloan 2008), and an irradiance cube holding E
 * (not E / pi) by direct cosine convolution of a pyramid level or reconstructed from the SH9.
 */
import { type Sh9WindowKind } from '@lightkiln/math';
import { type StageContext } from './context.js';
import { type Pyramid } from './pyramid.js';
export interface ShResult {
    /** Radiance coefficients L_lm, 27 numbers (9 x RGB), window applied. */
    readonly radiance: Float64Array;
    /** Irradiance coefficients A_l L_lm. */
    readonly irradiance: Float64Array;
}
/**
 * Projects a cube level onto SH9: L_lm = sum_texels L Y_lm dOmega (exact texel solid angles), as per-row
 * partial sums on the pool (kernels/sh-project.ts) added here in row order.
 */
export declare function projectSh9(pyramid: Pyramid, level: number, window: Sh9WindowKind, windowWidth: number, ctx: StageContext): Promise<ShResult>;
/** The source level used for the direct convolution: the largest with faces of at most 64 texels. */
export declare function convolutionSourceLevel(pyramid: Pyramid): number;
/**
 * The source table of kernels/convolve.ts convolveIrradiance for a pyramid level: per texel its centre
 * direction, exact solid angle, and RGB radiance times that solid angle (eight float64, shared memory).
 */
export declare function convolutionSource(pyramid: Pyramid, level: number): Float64Array;
/** The irradiance cube; `shResult` (called only when the cube is reconstructed from SH9) gives the projection. */
export declare function irradianceCube(pyramid: Pyramid, size: number, source: 'convolution' | 'sh9', shResult: () => Promise<ShResult>, ctx: StageContext): Promise<Float32Array>;
//# sourceMappingURL=irradiance.d.ts.map