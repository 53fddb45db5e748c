/**
 * Stage 5 kernel: the SH9 projection of a cube level (Ramamoorthi & Hanrahan 2001), L_lm = sum over texels
 * of L Y_lm(d) dOmega with exact texel solid angles, as one partial sum per face row (item = f * n + y,
 * 27 float64 per item in buffers.dst). The caller adds the rows in order, so the result does not depend on
 * how the rows were split into tiles. Solid angles come from the level's node geometry table
 * (buffers.geometry, one face, stages/node-geometry.ts), which holds cubeTexelSolidAngle per texel.
 */
import type { SharedBuffers } from '@lightkiln/pool';
export interface ShRowsParams {
    /** Face size of the level and the float offset of its first texel in buffers.pyramid (RGB float32). */
    readonly size: number;
    readonly offset: number;
    /** Float offset of the level's table in buffers.geometry. */
    readonly geometryOffset: number;
}
export declare function projectSh9Rows(buffers: SharedBuffers, begin: number, end: number, params: ShRowsParams): void;
//# sourceMappingURL=sh-project.d.ts.map