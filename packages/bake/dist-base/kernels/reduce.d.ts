/**
 * Stage 3 kernel: one step of the source pyramid. A parent texel is the solid-angle-weighted mean of its
 * 2 x 2 children, so every level keeps the radiance integral of the level above (exact texel solid
 * angles from cubeTexelSolidAngle in @lightkiln/math).
 */
import type { SharedBuffers } from '@lightkiln/pool';
export interface ReduceParams {
    /** Parent face size; the child level has 2 * size. */
    readonly size: number;
    readonly srcOffset: number;
    readonly dstOffset: number;
    /**
     * With buffers.centroids and buffers.geometry: texel offsets of the child and parent levels there
     * (centroid offsets are 3 floats a texel, the node table NODE_STRIDE a face texel).
     */
    readonly childNodeOffset?: number;
    readonly parentNodeOffset?: number;
    readonly childGeometryOffset?: number;
    readonly parentGeometryOffset?: number;
}
/** buffers.pyramid: all levels concatenated (RGB float64); items are parent texels of this level. */
export declare function reducePyramid(buffers: SharedBuffers, begin: number, end: number, params: ReduceParams): void;
//# sourceMappingURL=reduce.d.ts.map