/**
 * What the hierarchical quadrature (kernels/quadrature.ts) asks of one node for one direction n: the
 * opening test (classifyNode) and the mean of the weight over the node (lobeMean). Scalar functions,
 * small enough for the optimising compiler to inline into the walk. Geometry fields read
 * (stages/node-geometry.ts): solid angle 3, cos rho 4, sin rho 5, rho 6, |mean| 7.
 *
 * w(c) = D(h) max(c, 0) with v = n and (n.h)^2 = (1 + c) / 2 (half-angle identity), GGX D (Walter et
 * al. 2007): D is proportional to 1 / (1 + a^2 + c (a^2 - 1))^2 and the constant cancels in the ratio.
 */
/** classifyNode flags. Wholly below the horizon of n (psi - rho >= pi / 2): no weight, nothing else is set. */
export declare const CULLED = 1;
/** Its largest possible share of LD(n) is below the tolerance: accepted wherever it lies. */
export declare const NEGLIGIBLE = 2;
/** It straddles the horizon of n (psi + rho > pi / 2). */
export declare const STRADDLES = 4;
/** It is too wide for the lobe where it lies (only set when NEGLIGIBLE is not). */
export declare const OPENS = 8;
/** Per-level, per-region constants of the test, in a Float64Array of this layout. */
export declare const WALK_A2 = 0;
export declare const WALK_THETA2 = 1;
export declare const WALK_LOBE_WIDTH2 = 2;
export declare const WALK_Y_MEAN = 3;
export declare const WALK_NEGLIGIBLE_Y = 4;
export declare const WALK_SHARE_SCALE = 5;
export declare const WALK_BRIGHT_Y = 6;
export declare const WALK_CONSTANTS = 7;
/** Accumulator layout (Float64Array): normaliser, RGB of ordinary nodes, RGB of bright nodes, count. */
export declare const SUM_DEN = 0;
export declare const SUM_R = 1;
export declare const SUM_BRIGHT_R = 4;
export declare const SUM_COUNT = 7;
export declare const SUM_LENGTH = 8;
/**
 * Mean of w(n.l) over a node whose directions have mean vector of length m and n.l mean cMean, with
 * cosBeta the cosine between n and the mean direction: the variance of n.l for a spread symmetric about
 * the mean direction is cos^2(beta) (1 - m)^2 / 3 + sin^2(beta) (1 - m) (small-angle expansion, ours), and a
 * two-point rule with that mean and variance (upper point kept at or below 1) gives the mean.
 */
export declare function lobeMean(cMean: number, m: number, cosBeta: number, a2: number): number;
/**
 * The opening test of a node at angle psi (its cosine and sine) from n, with geometry at geo[gi] and
 * luminance y: flags of the constants above. A node is opened (its four children visited) unless it is
 * NEGLIGIBLE, when it STRADDLES the horizon or OPENS: angular radius rho above theta max(|n - g|, gamma
 * alpha), scaled down by sqrt(mean luminance / node luminance) for bright nodes and relaxed for nodes of
 * small share. Every flag is monotone in psi (CULLED and STRADDLES set from some psi on, NEGLIGIBLE
 * too, OPENS up to some psi), which is what lets a block of directions share the test.
 */
export declare function classifyNode(cosPsi: number, sinPsi: number, geo: Float64Array, gi: number, y: number, c: Float64Array): number;
//# sourceMappingURL=quadrature-node.d.ts.map