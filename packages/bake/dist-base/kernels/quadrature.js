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
import { NODE_STRIDE } from '../stages/node-geometry.js';
import { NODE_TABLE_STRIDE } from './node-table.js';
import { texelCentreDirection } from './texel.js';
/** Int32 numbers per pyramid level in buffers.levelTable: size, RGB float offset, first texel, geometry offset. */
export const LEVEL_TABLE_STRIDE = 4;
/** w(c) up to a constant: D(h) max(c, 0) with v = n (see the module comment). */
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
function lobeMean(cMean, m, cosBeta, a2) {
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
        // common denominator (one division instead of five: this runs for every accepted node).
        const down = variance / up;
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
 * buffers.nodes (the node table of kernels/node-table.ts, float32), buffers.geometry (node geometry of one
 * face, float64), buffers.levelTable (int32), buffers.dst (RGB float32); buffers.visits (float32, one per
 * item): nodes accumulated for the item (the cost statistic of the manifest).
 */
export function prefilterQuadrature(buffers, begin, end, params) {
    const nodes = buffers.nodes;
    const geo = buffers.geometry;
    const table = buffers.levelTable;
    const dst = buffers.dst;
    const visits = buffers.visits;
    const size = params.size;
    const a2 = params.alphaSquared;
    const theta2 = params.theta * params.theta;
    const lobeWidth2 = params.lobeWidth * params.lobeWidth;
    const yGlobal = params.meanLuminance;
    const top = params.levels - 1;
    // The level of 4 x 4 faces (or the finest, for smaller pyramids): its texel around n sets the local
    // luminance scale of the tolerances, so dark regions of a scene lit by a bright sun are not
    // integrated against the sun's share of the mean.
    const finest = params.finestLevel;
    const localLevel = top - 2 >= finest ? top - 2 : finest;
    const localSize = table[localLevel * LEVEL_TABLE_STRIDE];
    const localFirst = table[localLevel * LEVEL_TABLE_STRIDE + 2];
    const perFaceOut = size * size;
    const negligible = params.negligible;
    const shareScale = params.shareScale;
    const invExact = 1 / params.lobeIntegral;
    const centre = new Float64Array(3);
    // Stack entries, one int each: level (bits 27-30), face (24-26), x (12-23), y (0-11); faces up to 4096.
    const stack = new Int32Array(8 + 4 * params.levels);
    for (let item = begin; item < end; item++) {
        const local = item - params.levelBegin;
        texelCentreDirection(centre, local, size);
        const nx = centre[0];
        const ny = centre[1];
        const nz = centre[2];
        const outFace = (local / perFaceOut) | 0;
        const outRem = local - outFace * perFaceOut;
        const outY = (outRem / size) | 0;
        const lt = localFirst + (outFace * localSize + (((outY * localSize) / size) | 0)) * localSize + ((((outRem - outY * size) * localSize) / size) | 0);
        const yLocal = nodes[lt * NODE_TABLE_STRIDE + 6];
        const yMean = yLocal > 0 && yLocal < yGlobal ? yLocal : yGlobal;
        const negligibleY = negligible * yMean;
        let sr = 0;
        let sg = 0;
        let sb = 0;
        let br = 0;
        let bg = 0;
        let bb = 0;
        const brightY = params.brightRatio * yMean;
        let den = 0;
        let accepted = 0;
        // The six 1 x 1 faces.
        let sp = 0;
        for (let f = 5; f >= 0; f--) {
            stack[sp++] = (top << 27) | (f << 24);
        }
        while (sp > 0) {
            const entry = stack[--sp];
            const ty = entry & 4095;
            const tx = (entry >>> 12) & 4095;
            const face = (entry >>> 24) & 7;
            const k = entry >>> 27;
            const tk = k * LEVEL_TABLE_STRIDE;
            const nk = table[tk];
            const rem = ty * nk + tx;
            const no = (table[tk + 2] + face * nk * nk + rem) * NODE_TABLE_STRIDE;
            const gi = table[tk + 3] + rem * NODE_STRIDE;
            // Cosine between n and the node's geometric mean direction.
            let cosPsi = nx * nodes[no] + ny * nodes[no + 1] + nz * nodes[no + 2];
            if (cosPsi > 1)
                cosPsi = 1;
            else if (cosPsi < -1)
                cosPsi = -1;
            const sinPsi = Math.sqrt(1 - cosPsi * cosPsi);
            const cosR = geo[gi + 4];
            const sinR = geo[gi + 5];
            // Wholly below the horizon of n (psi - rho >= pi / 2): no weight.
            if (cosPsi * cosR + sinPsi * sinR <= 0)
                continue;
            const y = nodes[no + 6];
            const omega = geo[gi + 3];
            // Largest n.l in the node, cos(psi - rho) (1 when n lies inside it): wMax = w(xMax) = xMax / qMax^2
            // bounds w over the node. The tests below multiply through by qMax^2 instead of dividing.
            const xMax = sinPsi * cosR <= cosPsi * sinR ? 1 : cosPsi * cosR + sinPsi * sinR;
            const qMax = 1 + a2 + xMax * (a2 - 1);
            const qMax2 = qMax * qMax;
            if (k > finest) {
                const yBig = y > yMean ? y : yMean;
                // bound = Omega wMax yBig, the node's largest possible contribution.
                const boundQ = omega * xMax * yBig;
                if (boundQ > negligibleY * qMax2) {
                    const rho = geo[gi + 6];
                    const chord2 = 2 - 2 * cosPsi;
                    const reach2 = theta2 * (chord2 > lobeWidth2 ? chord2 : lobeWidth2);
                    // Open when rho^2 yBig relax > reach2 yMean, relax = sqrt(share / yMean) with share = bound
                    // shareScale when that is below yMean (else 1): tested squared, with no root or division.
                    const shareQ = boundQ * shareScale;
                    const lhs = rho * rho * yBig;
                    const rhs = reach2 * yMean;
                    const opens = shareQ < yMean * qMax2 && shareScale > 0 ? lhs * lhs * shareQ > rhs * rhs * yMean * qMax2 : lhs > rhs;
                    if (cosPsi * cosR - sinPsi * sinR < 0 || opens) {
                        const k1 = k - 1;
                        const x2 = 2 * tx;
                        const y2 = 2 * ty;
                        const child = (k1 << 27) | (face << 24) | (x2 << 12) | y2;
                        stack[sp++] = child;
                        stack[sp++] = child + 4096;
                        stack[sp++] = child + 1;
                        stack[sp++] = child + 4097;
                        continue;
                    }
                }
            }
            const wMax = xMax / qMax2;
            const mLen = geo[gi + 7];
            const wG = lobeMean(cosPsi * mLen, mLen, cosPsi, a2);
            den += omega * (wG < wMax ? wG : wMax);
            accepted++;
            if (y > 0) {
                const ox = nodes[no + 7];
                const oy = nodes[no + 8];
                const oz = nodes[no + 9];
                let wY;
                if (ox === 0 && oy === 0 && oz === 0) {
                    wY = wG;
                }
                else {
                    const lx = nodes[no] * mLen + ox;
                    const ly = nodes[no + 1] * mLen + oy;
                    const lz = nodes[no + 2] * mLen + oz;
                    let yLen = Math.sqrt(lx * lx + ly * ly + lz * lz);
                    if (yLen > 1)
                        yLen = 1;
                    const cY = nx * lx + ny * ly + nz * lz;
                    wY = lobeMean(cY, yLen, yLen > 0 ? cY / yLen : 0, a2);
                }
                if (wY > wMax)
                    wY = wMax;
                wY *= omega;
                if (y > brightY) {
                    br += wY * nodes[no + 3];
                    bg += wY * nodes[no + 4];
                    bb += wY * nodes[no + 5];
                }
                else {
                    sr += wY * nodes[no + 3];
                    sg += wY * nodes[no + 4];
                    sb += wY * nodes[no + 5];
                }
            }
        }
        const o = params.dstOffset + local * 3;
        const inv = den > 0 ? 1 / den : 0;
        dst[o] = sr * inv + br * invExact;
        dst[o + 1] = sg * inv + bg * invExact;
        dst[o + 2] = sb * inv + bb * invExact;
        visits[item] = accepted;
    }
}
//# sourceMappingURL=quadrature.js.map