/**
 * Stage 2 kernel for cube sources: area-correct resampling of a source cube onto the level-0 cube. Each
 * destination texel averages k x k stratified points of its footprint, each weighted by the face's
 * solid-angle element (1 + u^2 + v^2)^(-3/2), with bilinear source fetches; the rotation about +Y is
 * applied here. (Equirect sources take the energy-exact splat of kernels/splat.ts.)
 */
import { CUBE_FACE_BASIS, directionToCubeFace } from '@lightkiln/math';
import { fetchFaceBilinear } from './cube-fetch.js';
/** buffers.src: source cube RGB float32 of face size srcWidth; buffers.dst: cube RGB float32. */
export function resampleCube(buffers, begin, end, params) {
    const src = buffers.src;
    const dst = buffers.dst;
    const size = params.size;
    const k = params.supersample;
    const c = params.rotCos;
    const sn = params.rotSin;
    const srcSize = params.srcWidth;
    const B = CUBE_FACE_BASIS;
    const perFace = size * size;
    const sel = new Float64Array(3);
    const acc = new Float64Array(3);
    for (let i = begin; i < end; i++) {
        const face = (i / perFace) | 0;
        const rem = i - face * perFace;
        const ty = (rem / size) | 0;
        const tx = rem - ty * size;
        const b = face * 9;
        acc[0] = 0;
        acc[1] = 0;
        acc[2] = 0;
        let wsum = 0;
        for (let sy = 0; sy < k; sy++) {
            const v = (2 * (ty + (sy + 0.5) / k)) / size - 1;
            for (let sx = 0; sx < k; sx++) {
                const u = (2 * (tx + (sx + 0.5) / k)) / size - 1;
                const q = 1 + u * u + v * v;
                const w = 1 / (q * Math.sqrt(q));
                const dx = B[b] + u * B[b + 3] + v * B[b + 6];
                const dy = B[b + 1] + u * B[b + 4] + v * B[b + 7];
                const dz = B[b + 2] + u * B[b + 5] + v * B[b + 8];
                directionToCubeFace(sel, 0, dx * c - dz * sn, dy, dx * sn + dz * c);
                fetchFaceBilinear(acc, src, 0, srcSize, sel[0], sel[1], sel[2], w);
                wsum += w;
            }
        }
        const o = i * 3;
        dst[o] = acc[0] / wsum;
        dst[o + 1] = acc[1] / wsum;
        dst[o + 2] = acc[2] / wsum;
    }
}
//# sourceMappingURL=resample.js.map