/**
 * Brute-force convolutions over a source cube level: the `reference` specular mode (ground truth for tests
 * and the sample-budget sweep) and the direct cosine convolution of the irradiance cube. For the latter,
 * buffers.srcDirs holds per source texel (x, y, z, solid angle) as float64 (exact texel solid angles).
 */
import { CUBE_FACE_BASIS } from '@lightkiln/math';
import { texelCentreDirection } from './texel.js';
/**
 * Reference LD(n) with n = v: a deterministic quadrature of
 * integral L(l) D(h) (n.l) dl / integral D(h) (n.l) dl over the whole sphere: one point per level-0
 * texel, or subdivision^2 points in texels near the lobe peak where D changes within a texel; each point
 * weighted by its solid angle (face area element (1 + u^2 + v^2)^(-3/2) du dv) and reading L with the same
 * in-face bilinear fetch as the sampled kernel, so that plain importance sampling converges to it.
 * (n.h)^2 = (1 + n.l) / 2 (half-angle identity); GGX D (Walter et al. 2007; 1/pi cancels in the ratio).
 */
export function referenceSpecular(buffers, begin, end, params) {
    const pyr = buffers.pyramid;
    const dst = buffers.dst;
    const size = params.size;
    const a2 = params.alpha * params.alpha;
    const N = params.srcSize;
    const S = params.subdivision;
    const cosNear = params.cosNear;
    const du = 2 / N;
    const B = CUBE_FACE_BASIS;
    const n = new Float64Array(3);
    const acc = new Float64Array(4);
    for (let item = begin; item < end; item++) {
        const local = item - params.levelBegin;
        texelCentreDirection(n, local, size);
        const nx = n[0];
        const ny = n[1];
        const nz = n[2];
        acc[0] = 0;
        acc[1] = 0;
        acc[2] = 0;
        acc[3] = 0;
        for (let f = 0; f < 6; f++) {
            for (let j = 0; j < N; j++) {
                for (let i = 0; i < N; i++) {
                    const u = (i + 0.5) * du - 1;
                    const v = (j + 0.5) * du - 1;
                    const o9 = f * 9;
                    const dx = B[o9] + u * B[o9 + 3] + v * B[o9 + 6];
                    const dy = B[o9 + 1] + u * B[o9 + 4] + v * B[o9 + 7];
                    const dz = B[o9 + 2] + u * B[o9 + 5] + v * B[o9 + 8];
                    const dot = nx * dx + ny * dy + nz * dz;
                    const inv = 1 / Math.sqrt(1 + u * u + v * v);
                    if (S > 1 && dot * inv > cosNear) {
                        const sub = du / S;
                        for (let sj = 0; sj < S; sj++) {
                            for (let si = 0; si < S; si++) {
                                referencePoint(acc, pyr, N, f, u + (si + 0.5 - S / 2) * sub, v + (sj + 0.5 - S / 2) * sub, nx, ny, nz, a2, 1 / (S * S));
                            }
                        }
                    }
                    else if (dot > 0) {
                        referencePoint(acc, pyr, N, f, u, v, nx, ny, nz, a2, 1);
                    }
                }
            }
        }
        const o = params.dstOffset + local * 3;
        dst[o] = acc[0] / acc[3];
        dst[o + 1] = acc[1] / acc[3];
        dst[o + 2] = acc[2] / acc[3];
    }
}
/** Adds one quadrature point (face f at (u, v), relative area `area`) to acc = (r, g, b, weight). */
function referencePoint(acc, pyr, N, f, u, v, nx, ny, nz, a2, area) {
    const B = CUBE_FACE_BASIS;
    const o9 = f * 9;
    const dx = B[o9] + u * B[o9 + 3] + v * B[o9 + 6];
    const dy = B[o9 + 1] + u * B[o9 + 4] + v * B[o9 + 7];
    const dz = B[o9 + 2] + u * B[o9 + 5] + v * B[o9 + 8];
    const dot = nx * dx + ny * dy + nz * dz;
    if (dot <= 0)
        return;
    const inv = 1 / Math.sqrt(1 + u * u + v * v);
    const nl = dot * inv;
    const nh2 = (1 + nl) * 0.5;
    const dd = nh2 * (a2 - 1) + 1;
    const w = (a2 / (dd * dd)) * nl * inv * inv * inv * area; // D * n.l * dOmega (up to a constant)
    let fx = (u + 1) * 0.5 * N - 0.5;
    let fy = (v + 1) * 0.5 * N - 0.5;
    const max = N - 1;
    if (fx < 0)
        fx = 0;
    else if (fx > max)
        fx = max;
    if (fy < 0)
        fy = 0;
    else if (fy > max)
        fy = max;
    const x0 = fx | 0;
    const y0 = fy | 0;
    const ex = fx - x0;
    const ey = fy - y0;
    const i00 = f * N * N * 3 + (y0 * N + x0) * 3;
    const i10 = x0 < max ? i00 + 3 : i00;
    const i01 = y0 < max ? i00 + N * 3 : i00;
    const i11 = i01 + i10 - i00;
    const w11 = ex * ey * w;
    const w10 = ex * w - w11;
    const w01 = ey * w - w11;
    const w00 = w - ex * w - w01;
    acc[0] = acc[0] + pyr[i00] * w00 + pyr[i10] * w10 + pyr[i01] * w01 + pyr[i11] * w11;
    acc[1] = acc[1] + pyr[i00 + 1] * w00 + pyr[i10 + 1] * w10 + pyr[i01 + 1] * w01 + pyr[i11 + 1] * w11;
    acc[2] = acc[2] + pyr[i00 + 2] * w00 + pyr[i10 + 2] * w10 + pyr[i01 + 2] * w01 + pyr[i11 + 2] * w11;
    acc[3] = acc[3] + w;
}
/**
 * Irradiance E(n) = integral L max(0, n.l) dl (E, not E / pi) as a normalised quadrature:
 * pi * sum_j L_j w_j / sum_j w_j with w_j = max(0, n.l_j) dOmega_j, using integral max(0, n.l) dl = pi,
 * so a constant environment gives exactly pi L despite texels straddling the horizon.
 */
export function convolveIrradiance(buffers, begin, end, params) {
    // buffers.srcDirs: per source texel (x, y, z, dOmega, R dOmega, G dOmega, B dOmega, 0), float64.
    const src = buffers.srcDirs;
    const dst = buffers.dst;
    const size = params.size;
    const count = params.srcTexels;
    const n = new Float64Array(3);
    for (let item = begin; item < end; item++) {
        const local = item - params.levelBegin;
        texelCentreDirection(n, local, size);
        const nx = n[0];
        const ny = n[1];
        const nz = n[2];
        let r = 0;
        let g = 0;
        let b = 0;
        let wsum = 0;
        for (let j = 0, o = 0; j < count; j++, o += 8) {
            let c = nx * src[o] + ny * src[o + 1] + nz * src[o + 2];
            c = c > 0 ? c : 0;
            r += c * src[o + 4];
            g += c * src[o + 5];
            b += c * src[o + 6];
            wsum += c * src[o + 3];
        }
        const o = params.dstOffset + local * 3;
        const k = Math.PI / wsum;
        dst[o] = r * k;
        dst[o + 1] = g * k;
        dst[o + 2] = b * k;
    }
}
//# sourceMappingURL=convolve.js.map