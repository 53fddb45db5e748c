/**
 * Stage 5 kernel: the SH9 projection of a cube level (Ramamoorthi & Hanrahan 2001), L_lm = sum over texels
 * of L Y_lm(d) dOmega with exact texel solid angles, as one partial sum per face row (item = f * n + y,
 * 27 float64 per item in buffers.dst). The caller adds the rows in order, so the result does not depend on
 * how the rows were split into tiles. Solid angles come from the level's node geometry table
 * (buffers.geometry, one face, stages/node-geometry.ts), which holds cubeTexelSolidAngle per texel.
 */
import { accumulateSh9, cubeTexelCenterDirection } from '@lightkiln/math';
import { NODE_STRIDE } from '../stages/node-geometry.js';
export function projectSh9Rows(buffers, begin, end, params) {
    const src = buffers.pyramid;
    const dst = buffers.dst;
    const geo = buffers.geometry;
    const n = params.size;
    const d = new Float64Array(3);
    const row = new Float64Array(27);
    for (let item = begin; item < end; item++) {
        const f = (item / n) | 0;
        const y = item - f * n;
        row.fill(0);
        for (let x = 0; x < n; x++) {
            const t = params.offset + ((f * n + y) * n + x) * 3;
            cubeTexelCenterDirection(d, 0, f, x, y, n);
            accumulateSh9(row, d[0], d[1], d[2], src[t], src[t + 1], src[t + 2], geo[params.geometryOffset + (y * n + x) * NODE_STRIDE + 3]);
        }
        dst.set(row, item * 27);
    }
}
//# sourceMappingURL=sh-project.js.map