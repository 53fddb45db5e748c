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
export const CULLED = 1;
/** Its largest possible share of LD(n) is below the tolerance: accepted wherever it lies. */
export const NEGLIGIBLE = 2;
/** It straddles the horizon of n (psi + rho > pi / 2). */
export const STRADDLES = 4;
/** It is too wide for the lobe where it lies (only set when NEGLIGIBLE is not). */
export const OPENS = 8;
/** Per-level, per-region constants of the test, in a Float64Array of this layout. */
export const WALK_A2 = 0;
export const WALK_THETA2 = 1;
export const WALK_LOBE_WIDTH2 = 2;
export const WALK_Y_MEAN = 3;
export const WALK_NEGLIGIBLE_Y = 4;
export const WALK_SHARE_SCALE = 5;
export const WALK_BRIGHT_Y = 6;
export const WALK_CONSTANTS = 7;
/** Accumulator layout (Float64Array): normaliser, RGB of ordinary nodes, RGB of bright nodes, count. */
export const SUM_DEN = 0;
export const SUM_R = 1;
export const SUM_BRIGHT_R = 4;
export const SUM_COUNT = 7;
export const SUM_LENGTH = 8;
/** w(c) up to a constant (see the module comment). */
function lobe(c, a2) {
    if (c <= 0)
        return 0;
    const q = 1 + a2 + c * (a2 - 1);
    return c / (q * q);
}
/**
 * Mean of w(n.l) over a node whose directions have mean vector of length m and n.l mean cMean, with
 * cosBeta the cosine between n and the mean direction: the variance of n.l for a spread symmetric about
 * the mean direction is cos^2(beta) (1 - m)^2 / 3 + sin^2(beta) (1 - m) (small-angle expansion, ours), and a
 * two-point rule with that mean and variance (upper point kept at or below 1) gives the mean.
 */
export function lobeMean(cMean, m, cosBeta, a2) {
    const om = 1 - m;
    const cb2 = cosBeta * cosBeta;
    const variance = cb2 * om * om * (1 / 3) + (1 - cb2) * om;
    if (!(variance > 1e-30))
        return lobe(cMean, a2);
    const sigma = Math.sqrt(variance);
    const room = 1 - cMean;
    const up = sigma < room ? sigma : room;
    if (!(up > 0))
        return lobe(cMean, a2);
    if (cMean * up >= variance) {
        // p w(c + up) + (1 - p) w(c - down) with p = down / (up + down) and w(x) = x / q(x)^2, over one
        // common denominator (one division instead of five: this runs for every accepted node). Away from
        // the peak up = sigma, so down = variance / up = sigma with no division.
        const down = sigma < room ? sigma : variance / up;
        const x1 = cMean + up;
        const x2 = cMean - down;
        const q1 = 1 + a2 + x1 * (a2 - 1);
        const q2 = 1 + a2 + x2 * (a2 - 1);
        const q1s = q1 * q1;
        const q2s = q2 * q2;
        return (down * x1 * q2s + up * x2 * q1s) / ((up + down) * q1s * q2s);
    }
    // Across the horizon of n: n.l taken as uniform on [cMean - h, cMean + h] with the same variance
    // (h = sqrt(3) sigma), so E[max(c, 0)] = b^2 / (2 (b - a)) with D taken at the mean of the lit part.
    const h = 1.7320508075688772 * sigma;
    const hi = cMean + h;
    if (hi <= 0)
        return 0;
    return (lobe(0.5 * hi, a2) * hi) / (2 * h);
}
/**
 * The opening test of a node at angle psi (its cosine and sine) from n, with geometry at geo[gi] and
 * luminance y: flags of the constants above. A node is opened (its four children visited) unless it is
 * NEGLIGIBLE, when it STRADDLES the horizon or OPENS: angular radius rho above theta max(|n - g|, gamma
 * alpha), scaled down by sqrt(mean luminance / node luminance) for bright nodes and relaxed for nodes of
 * small share. Every flag is monotone in psi (CULLED and STRADDLES set from some psi on, NEGLIGIBLE
 * too, OPENS up to some psi), which is what lets a block of directions share the test.
 */
export function classifyNode(cosPsi, sinPsi, geo, gi, y, c) {
    const cosR = geo[gi + 4];
    const sinR = geo[gi + 5];
    if (cosPsi * cosR + sinPsi * sinR <= 0)
        return CULLED;
    const straddles = cosPsi * cosR - sinPsi * sinR < 0 ? STRADDLES : 0;
    // Largest n.l in the node, cos(psi - rho) (1 when n lies inside it): w(xMax) = xMax / qMax^2 bounds w
    // over the node. The tests below multiply through by qMax^2 instead of dividing.
    const xMax = sinPsi * cosR <= cosPsi * sinR ? 1 : cosPsi * cosR + sinPsi * sinR;
    const a2 = c[WALK_A2];
    const qMax = 1 + a2 + xMax * (a2 - 1);
    const qMax2 = qMax * qMax;
    const yMean = c[WALK_Y_MEAN];
    const yBig = y > yMean ? y : yMean;
    // bound = Omega w(xMax) yBig, the node's largest possible contribution.
    const boundQ = geo[gi + 3] * xMax * yBig;
    if (!(boundQ > c[WALK_NEGLIGIBLE_Y] * qMax2))
        return NEGLIGIBLE | straddles;
    const rho = geo[gi + 6];
    const chord2 = 2 - 2 * cosPsi;
    const lobeWidth2 = c[WALK_LOBE_WIDTH2];
    const reach2 = c[WALK_THETA2] * (chord2 > lobeWidth2 ? chord2 : lobeWidth2);
    // Open when rho^2 yBig relax > reach2 yMean, relax = sqrt(share / yMean) with share = bound
    // shareScale when that is below yMean (else 1): tested squared, with no root or division.
    const shareScale = c[WALK_SHARE_SCALE];
    const shareQ = boundQ * shareScale;
    const lhs = rho * rho * yBig;
    const rhs = reach2 * yMean;
    const opens = shareQ < yMean * qMax2 && shareScale > 0 ? lhs * lhs * shareQ > rhs * rhs * yMean * qMax2 : lhs > rhs;
    return opens ? OPENS | straddles : straddles;
}
//# sourceMappingURL=quadrature-node.js.map