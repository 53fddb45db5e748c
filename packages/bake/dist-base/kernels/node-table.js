/**
 * Per-bake node table of the hierarchical quadrature: for every pyramid texel of every level, the world-frame
 * data the tree walk reads, packed so one node is one run of NODE_TABLE_STRIDE float32 (40 bytes):
 * unit geometric mean direction (3), RGB mean radiance (3), luminance (Rec. 709 weights, ITU-R BT.709-6),
 * and the luminance-weighted mean direction vector minus the geometric mean vector (3; the mean vector
 * has length 1 for a point light, less when spread).
 * Built once per bake from the pyramid, the node geometry table and the centroid offsets, so the walk
 * does no face-frame rotations. Float32 keeps 1 - n.l accurate to about 1e-7, far below the alpha^2 of
 * any level the bake makes.
 */
import { CUBE_FACE_BASIS } from '@lightkiln/math';
import { NODE_STRIDE } from '../stages/node-geometry.js';
export const NODE_TABLE_STRIDE = 10;
/**
 * Items are texels of one level, faces one after another. buffers.pyramid (RGB float64),
 * buffers.centroids (float32, face frame offsets), buffers.geometry (node geometry of one face),
 * buffers.nodes (float32 out).
 */
export function buildNodeTable(buffers, begin, end, params) {
    const pyr = buffers.pyramid;
    const cent = buffers.centroids;
    const geo = buffers.geometry;
    const nodes = buffers.nodes;
    const B = CUBE_FACE_BASIS;
    const perFace = params.size * params.size;
    for (let item = begin; item < end; item++) {
        const face = (item / perFace) | 0;
        const gi = params.geometryOffset + (item - face * perFace) * NODE_STRIDE;
        const b = face * 9;
        const mc = geo[gi];
        const mu = geo[gi + 1];
        const mv = geo[gi + 2];
        const inv = 1 / geo[gi + 7];
        const t = params.firstTexel + item;
        const o = (params.nodeOffset + item) * NODE_TABLE_STRIDE;
        nodes[o] = (B[b] * mc + B[b + 3] * mu + B[b + 6] * mv) * inv;
        nodes[o + 1] = (B[b + 1] * mc + B[b + 4] * mu + B[b + 7] * mv) * inv;
        nodes[o + 2] = (B[b + 2] * mc + B[b + 5] * mu + B[b + 8] * mv) * inv;
        const r = pyr[t * 3];
        const g = pyr[t * 3 + 1];
        const bl = pyr[t * 3 + 2];
        nodes[o + 3] = r;
        nodes[o + 4] = g;
        nodes[o + 5] = bl;
        nodes[o + 6] = 0.2126 * r + 0.7152 * g + 0.0722 * bl;
        // The centroid offset turned to the world frame: zero where the light is uniform, so that the
        // light's weight equals the geometry's exactly there.
        const yc = cent[t * 3];
        const yu = cent[t * 3 + 1];
        const yv = cent[t * 3 + 2];
        // Offsets below 1e-9 are rounding of a uniform texel's moments (float32 keeps about 1e-7 of a
        // direction anyway): exactly 0, so its light is weighted exactly as its geometry.
        const small = yc * yc + yu * yu + yv * yv < 1e-18;
        nodes[o + 7] = small ? 0 : B[b] * yc + B[b + 3] * yu + B[b + 6] * yv;
        nodes[o + 8] = small ? 0 : B[b + 1] * yc + B[b + 4] * yu + B[b + 7] * yv;
        nodes[o + 9] = small ? 0 : B[b + 2] * yc + B[b + 5] * yu + B[b + 8] * yv;
    }
}
//# sourceMappingURL=node-table.js.map