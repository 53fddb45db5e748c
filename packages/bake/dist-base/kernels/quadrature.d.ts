/**
 * Stage 4 kernel, the default: prefiltered radiance LD(n) (split sum with n = v = r, Karis 2013) by a
 * deterministic hierarchical quadrature over the source pyramid, in the manner of a Barnes-Hut tree code
 * (Barnes & Hut 1986, "A hierarchical O(N log N) force-calculation algorithm", Nature 324).
 *
 * LD(n) = sum over nodes of Lbar Omega E_Y[w(n.l)] / sum over nodes of Omega E_G[w(n.l)], where
 * w(c) = D(h) max(c, 0) with (n.h)^2 = (1 + c) / 2 (half-angle identity), GGX D (Walter et al. 2007):
 * D is proportional to 1 / (1 + a^2 + c (a^2 - 1))^2 and the constant cancels in the ratio. A node is a
 * pyramid texel; the walk starts at the six 1 x 1 faces and opens a node (visits its four children)
 * unless it is small against the lobe where it lies: angular radius rho below theta max(|n - g|, gamma
 * alpha), scaled down by sqrt(mean luminance / node luminance) for bright nodes, and not straddling the
 * horizon of n. Texels of the finest level in the node table are always accepted. E_G averages w over the node's geometry (mean
 * direction and its spread from the node table), E_Y over where its light is (the luminance centroid),
 * both by a two-point rule matching the mean and variance of n.l. A constant environment is exact: E_Y
 * equals E_G when the light is uniform.
 */
import type { SharedBuffers } from '@lightkiln/pool';
/** Int32 numbers per pyramid level in buffers.levelTable: size, RGB float offset, first texel, geometry offset. */
export declare const LEVEL_TABLE_STRIDE = 4;
export interface QuadratureParams {
    /** Output face size, first item of this level and float offset of its texels in buffers.dst. */
    readonly size: number;
    readonly levelBegin: number;
    readonly dstOffset: number;
    /** GGX alpha^2 of the level. */
    readonly alphaSquared: number;
    /** Opening criterion: theta, and gamma * alpha (the lobe's own width scale, radians). */
    readonly theta: number;
    readonly lobeWidth: number;
    /** Mean luminance of the environment (the 1 x 1 level), for the brightness scaling. */
    readonly meanLuminance: number;
    /** Number of pyramid levels (the coarsest has 1 x 1 faces), and the finest level in the node table. */
    readonly levels: number;
    readonly finestLevel: number;
    /**
     * A node whose largest possible share, Omega w_max max(Y, Ybar) / Ybar, is below this (the lobe
     * integral times the tolerance) is accepted as it is, wherever it lies.
     */
    readonly negligible: number;
    /** 1 / (the lobe integral times the share below which the opening angle widens). */
    readonly shareScale: number;
    /** The exact integral of w over the sphere, and the luminance ratio above which a node's light is normalised by it. */
    readonly lobeIntegral: number;
    readonly brightRatio: number;
}
/**
 * buffers.nodes (the node table of kernels/node-table.ts, float32), buffers.geometry (node geometry of one
 * face, float64), buffers.levelTable (int32), buffers.dst (RGB float32); buffers.visits (float32, one per
 * item): nodes accumulated for the item (the cost statistic of the manifest).
 */
export declare function prefilterQuadrature(buffers: SharedBuffers, begin: number, end: number, params: QuadratureParams): void;
//# sourceMappingURL=quadrature.d.ts.map