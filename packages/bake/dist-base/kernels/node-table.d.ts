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
import type { SharedBuffers } from '@lightkiln/pool';
export declare const NODE_TABLE_STRIDE = 10;
export interface NodeTableParams {
    /** Face size of the level, its first texel (pyramid texel index), its first node in the table, and its geometry table float offset. */
    readonly size: number;
    readonly firstTexel: number;
    readonly nodeOffset: number;
    readonly geometryOffset: number;
}
/**
 * Items are texels of one level, faces one after another. buffers.pyramid (RGB float64),
 * buffers.centroids (float32, face frame offsets), buffers.geometry (node geometry of one face),
 * buffers.nodes (float32 out).
 */
export declare function buildNodeTable(buffers: SharedBuffers, begin: number, end: number, params: NodeTableParams): void;
//# sourceMappingURL=node-table.d.ts.map