/**
 * Stage 4 kernel: prefiltered radiance LD(n) for one or more levels by GGX importance sampling with
 * n = v = r (split-sum prefilter, Karis 2013), NoL weights, and filtered importance sampling: each sample
 * reads the source pyramid at its own level of detail, trilinearly (bilinear on two levels), so bright
 * small sources are integrated instead of aliased (Krivanek & Colbert 2008, "Real-time Shading with
 * Filtered Importance Sampling", CGF 27(4)). The level's sample set is the same for every texel and is
 * precomputed (see stages/specular.ts): per sample (lx, ly, lz, NoL, (1 - frac) NoL, frac NoL) as float64 and
 * (offset0, size0, offset1, size1) of its two source levels as int32 (integer index math stays integral).
 */
import { fetchSeamlessBilinear } from './cube-fetch.js';
import { texelCentreDirection } from './texel.js';
export const SPECULAR_SAMPLE_STRIDE = 6;
export const SPECULAR_LEVEL_STRIDE = 4;
/**
 * buffers.pyramid (RGB float64, all levels), buffers.samples (float64), buffers.sampleLevels (int32),
 * buffers.dst (RGB float32),
 * buffers.err (float32, one per item: the standard error of the texel's luminance estimate, by the delta
 * method for the ratio estimator sum(w Y) / sum(w): sqrt(sum w^2 (Y - R)^2) / sum w (Cochran 1977,
 * "Sampling Techniques", 3rd ed., sec. 6.4; from memory). It treats the samples as independent, so for the
 * low-discrepancy set it is a conservative (high) estimate.
 */
export function prefilterSpecular(buffers, begin, end, params) {
    const pyr = buffers.pyramid;
    const S = buffers.samples;
    const L = buffers.sampleLevels;
    const dst = buffers.dst;
    const err = buffers.err;
    const size = params.size;
    const centre = new Float64Array(3);
    const edge = new Float64Array(3);
    const levelBegin = params.levelBegin;
    const dstOffset = params.dstOffset;
    const s0 = params.sampleOffset * SPECULAR_SAMPLE_STRIDE;
    const s1 = s0 + params.sampleCount * SPECULAR_SAMPLE_STRIDE;
    const l0 = params.sampleOffset * SPECULAR_LEVEL_STRIDE;
    const clamp = params.clampLuminance;
    const invW = params.weightSum > 0 ? 1 / params.weightSum : 0;
    const w2 = params.weightSquareSum;
    for (let item = begin; item < end; item++) {
        const local = item - levelBegin;
        texelCentreDirection(centre, local, size);
        const nx = centre[0];
        const ny = centre[1];
        const nz = centre[2];
        // Duff et al. 2017 orthonormal basis (b1 = t, b2 = b).
        const sign = nz >= 0 ? 1 : -1;
        const a = -1 / (sign + nz);
        const bb = nx * ny * a;
        const tX = 1 + sign * nx * nx * a;
        const tY = sign * bb;
        const tZ = -sign * nx;
        const bX = bb;
        const bY = sign + ny * ny * a;
        const bZ = -ny;
        let r = 0;
        let g = 0;
        let b = 0;
        let w2y = 0;
        let w2yy = 0;
        for (let k = s0, q = l0; k < s1; k += 6, q += 4) {
            const lx = S[k];
            const ly = S[k + 1];
            const lz = S[k + 2];
            const w = S[k + 3];
            const dx = tX * lx + bX * ly + nx * lz;
            const dy = tY * lx + bY * ly + ny * lz;
            const dz = tZ * lx + bZ * ly + nz * lz;
            // Face selection (ties: z, then y, then x).
            const ax = dx < 0 ? -dx : dx;
            const ay = dy < 0 ? -dy : dy;
            const az = dz < 0 ? -dz : dz;
            let f;
            let sc;
            let tc;
            let ma;
            if (az >= ay && az >= ax) {
                ma = az;
                tc = -dy;
                if (dz >= 0) {
                    f = 4;
                    sc = dx;
                }
                else {
                    f = 5;
                    sc = -dx;
                }
            }
            else if (ay >= ax) {
                ma = ay;
                sc = dx;
                if (dy >= 0) {
                    f = 2;
                    tc = dz;
                }
                else {
                    f = 3;
                    tc = -dz;
                }
            }
            else {
                ma = ax;
                tc = -dy;
                if (dx >= 0) {
                    f = 0;
                    sc = -dz;
                }
                else {
                    f = 1;
                    sc = dz;
                }
            }
            const im = 0.5 / ma;
            const fs = sc * im + 0.5;
            const ft = tc * im + 0.5;
            // Level l0 with weight (1 - frac) w, level l1 with weight frac w (when frac > 0); the NoL weight w
            // is folded into the bilinear weights, so sr, sg, sb are w times the sample's radiance.
            const n0 = L[q + 1];
            const max0 = (n0 - 1) | 0;
            let fx = fs * n0 - 0.5;
            let fy = ft * n0 - 0.5;
            let sr;
            let sg;
            let sb;
            // The coarser level read (l1 when the sample blends two) decides: its texels reach farther.
            const nc = S[k + 5] > 0 ? L[q + 3] : n0;
            const ex0 = fs * nc - 0.5;
            const ey0 = ft * nc - 0.5;
            if (ex0 < 0 || ex0 > nc - 1 || ey0 < 0 || ey0 > nc - 1) {
                // Within half a texel of a face edge: the seamless fetch (rare at fine levels), both levels.
                edge[0] = 0;
                edge[1] = 0;
                edge[2] = 0;
                fetchSeamlessBilinear(edge, pyr, L[q], n0, f, fx, fy, S[k + 4]);
                const wfe = S[k + 5];
                if (wfe > 0)
                    fetchSeamlessBilinear(edge, pyr, L[q + 2], L[q + 3], f, fs * L[q + 3] - 0.5, ft * L[q + 3] - 0.5, wfe);
                sr = edge[0];
                sg = edge[1];
                sb = edge[2];
            }
            else {
                let x0 = fx | 0;
                let y0 = fy | 0;
                let ex = fx - x0;
                let ey = fy - y0;
                let i00 = (L[q] + ((f * n0 + y0) * n0 + x0) * 3) | 0;
                let i10 = x0 < max0 ? (i00 + 3) | 0 : i00;
                let i01 = y0 < max0 ? (i00 + n0 * 3) | 0 : i00;
                let i11 = (i01 + i10 - i00) | 0;
                const wl = S[k + 4];
                let w11 = ex * ey * wl;
                let w10 = ex * wl - w11;
                let w01 = ey * wl - w11;
                let w00 = wl - ex * wl - w01;
                sr = pyr[i00] * w00 + pyr[i10] * w10 + pyr[i01] * w01 + pyr[i11] * w11;
                sg = pyr[i00 + 1] * w00 + pyr[i10 + 1] * w10 + pyr[i01 + 1] * w01 + pyr[i11 + 1] * w11;
                sb = pyr[i00 + 2] * w00 + pyr[i10 + 2] * w10 + pyr[i01 + 2] * w01 + pyr[i11 + 2] * w11;
                const wf = S[k + 5];
                if (wf > 0) {
                    const n1 = L[q + 3];
                    const max1 = (n1 - 1) | 0;
                    fx = fs * n1 - 0.5;
                    fy = ft * n1 - 0.5;
                    if (fx < 0)
                        fx = 0;
                    else if (fx > max1)
                        fx = max1;
                    if (fy < 0)
                        fy = 0;
                    else if (fy > max1)
                        fy = max1;
                    x0 = fx | 0;
                    y0 = fy | 0;
                    ex = fx - x0;
                    ey = fy - y0;
                    i00 = (L[q + 2] + ((f * n1 + y0) * n1 + x0) * 3) | 0;
                    i10 = x0 < max1 ? (i00 + 3) | 0 : i00;
                    i01 = y0 < max1 ? (i00 + n1 * 3) | 0 : i00;
                    i11 = (i01 + i10 - i00) | 0;
                    w11 = ex * ey * wf;
                    w10 = ex * wf - w11;
                    w01 = ey * wf - w11;
                    w00 = wf - ex * wf - w01;
                    sr += pyr[i00] * w00 + pyr[i10] * w10 + pyr[i01] * w01 + pyr[i11] * w11;
                    sg += pyr[i00 + 1] * w00 + pyr[i10 + 1] * w10 + pyr[i01 + 1] * w01 + pyr[i11 + 1] * w11;
                    sb += pyr[i00 + 2] * w00 + pyr[i10 + 2] * w10 + pyr[i01 + 2] * w01 + pyr[i11 + 2] * w11;
                }
            }
            // BT.709 luminance of the sample, times w.
            let wy = 0.2126 * sr + 0.7152 * sg + 0.0722 * sb;
            if (clamp > 0 && wy > clamp * w) {
                const scale = (clamp * w) / wy;
                sr *= scale;
                sg *= scale;
                sb *= scale;
                wy = clamp * w;
            }
            r += sr;
            g += sg;
            b += sb;
            w2y += w * wy;
            w2yy += wy * wy;
        }
        const o = dstOffset + local * 3;
        dst[o] = r * invW;
        dst[o + 1] = g * invW;
        dst[o + 2] = b * invW;
        const ratio = (0.2126 * r + 0.7152 * g + 0.0722 * b) * invW;
        const variance = w2yy - 2 * ratio * w2y + ratio * ratio * w2;
        err[item] = variance > 0 ? Math.sqrt(variance) * invW : 0;
    }
}
//# sourceMappingURL=specular.js.map