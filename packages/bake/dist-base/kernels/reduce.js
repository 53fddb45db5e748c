/**
 * Stage 3 kernel: one step of the source pyramid. A parent texel is the solid-angle-weighted mean of its
 * 2 x 2 children, so every level keeps the radiance integral of the level above (exact texel solid
 * angles from cubeTexelSolidAngle in @lightkiln/math).
 */
import { cubeTexelSolidAngle } from '@lightkiln/math';
import { NODE_STRIDE } from '../stages/node-geometry.js';
/** buffers.pyramid: all levels concatenated (RGB float64); items are parent texels of this level. */
export function reducePyramid(buffers, begin, end, params) {
    const pyr = buffers.pyramid;
    const size = params.size;
    const child = size * 2;
    const perFace = size * size;
    for (let i = begin; i < end; i++) {
        const face = (i / perFace) | 0;
        const rem = i - face * perFace;
        const y = (rem / size) | 0;
        const x = rem - y * size;
        let r = 0;
        let g = 0;
        let b = 0;
        let wsum = 0;
        for (let dy = 0; dy < 2; dy++) {
            for (let dx = 0; dx < 2; dx++) {
                const cx = 2 * x + dx;
                const cy = 2 * y + dy;
                const w = cubeTexelSolidAngle(cx, cy, child);
                const o = params.srcOffset + ((face * child + cy) * child + cx) * 3;
                r += pyr[o] * w;
                g += pyr[o + 1] * w;
                b += pyr[o + 2] * w;
                wsum += w;
            }
        }
        const o = params.dstOffset + i * 3;
        pyr[o] = r / wsum;
        pyr[o + 1] = g / wsum;
        pyr[o + 2] = b / wsum;
    }
    if (buffers.centroids !== undefined)
        reduceCentroids(buffers, begin, end, params);
}
/**
 * The luminance centroid of a parent texel: its luminance-weighted first moment is the sum of the
 * children's, Y_c Omega_c (mean_c + offset_c); stored as an offset from the parent's geometric mean
 * (face frame), 0 where the parent is black.
 */
function reduceCentroids(buffers, begin, end, params) {
    const pyr = buffers.pyramid;
    const cent = buffers.centroids;
    const geo = buffers.geometry;
    const size = params.size;
    const child = size * 2;
    const perFace = size * size;
    const childNodes = params.childNodeOffset;
    const parentNodes = params.parentNodeOffset;
    const childGeo = params.childGeometryOffset;
    const parentGeo = params.parentGeometryOffset;
    for (let i = begin; i < end; i++) {
        const face = (i / perFace) | 0;
        const rem = i - face * perFace;
        const y = (rem / size) | 0;
        const x = rem - y * size;
        let mc = 0;
        let mu = 0;
        let mv = 0;
        let yw = 0;
        for (let dy = 0; dy < 2; dy++) {
            for (let dx = 0; dx < 2; dx++) {
                const cx = 2 * x + dx;
                const cy = 2 * y + dy;
                const t = (face * child + cy) * child + cx;
                const o = params.srcOffset + t * 3;
                const g = childGeo + (cy * child + cx) * NODE_STRIDE;
                const w = (0.2126 * pyr[o] + 0.7152 * pyr[o + 1] + 0.0722 * pyr[o + 2]) * geo[g + 3];
                const co = (childNodes + t) * 3;
                mc += w * (geo[g] + cent[co]);
                mu += w * (geo[g + 1] + cent[co + 1]);
                mv += w * (geo[g + 2] + cent[co + 2]);
                yw += w;
            }
        }
        const po = (parentNodes + i) * 3;
        if (!(yw > 0)) {
            cent[po] = 0;
            cent[po + 1] = 0;
            cent[po + 2] = 0;
            continue;
        }
        const g = parentGeo + rem * NODE_STRIDE;
        cent[po] = mc / yw - geo[g];
        cent[po + 1] = mu / yw - geo[g + 1];
        cent[po + 2] = mv / yw - geo[g + 2];
    }
}
//# sourceMappingURL=reduce.js.map