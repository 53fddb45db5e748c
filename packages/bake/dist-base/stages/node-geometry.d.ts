/**
 * Geometry of every pyramid texel ("node") that the hierarchical quadrature needs, for one face (all six
 * faces are rotations of it, see CUBE_FACE_BASIS): per texel the exact solid angle, the mean direction
 * E[d] over the texel (its first moment divided by the solid angle, in the face frame C, U, V), the length
 * of that mean (1 for a point, less the wider the texel), and the angular radius around it.
 * Level-0 moments come from 4 x 4 Gauss-Legendre points per texel (Abramowitz & Stegun 1964, table 25.4);
 * coarser levels sum their four children, so every level integrates the same function exactly.
 */
import { type SharedBuffers } from '@lightkiln/pool';
import { type StageContext } from './context.js';
/** Numbers per texel in the table: mean (C, U, V), solid angle, cos rho, sin rho, rho, |mean|. */
export declare const NODE_STRIDE = 8;
export interface NodeGeometry {
    /** Face size of each level, level 0 first (as the pyramid). */
    readonly sizes: readonly number[];
    /** Float offset of each level's face table in data. */
    readonly offsets: readonly number[];
    readonly data: Float64Array;
}
/** Face sizes and float offsets of every level's table, and the table's length. */
export declare function nodeGeometryLayout(size: number): {
    sizes: number[];
    offsets: number[];
    length: number;
};
/**
 * The node table built on the pool (kernel buildNodeGeometry in three phases: level-0 moments by rows,
 * the coarser levels' sums, then means and radii by texels), so the calling thread is free (it decodes
 * the input meanwhile) and the threads share the work (a 1024 table is about 0.5 s on one thread);
 * memoised per size, shared with nodeGeometry().
 */
export declare function nodeGeometryOnPool(size: number, ctx: StageContext): Promise<NodeGeometry>;
/** The phases of the table: level-0 moments (items: rows), coarser levels' sums (one item), means and radii (items: texels of all levels). */
export type NodeGeometryPhase = 'moments' | 'sums' | 'finish';
/** Kernel: one phase of the table of face size params.size in buffers.geometry (see nodeGeometryOnPool). */
export declare function buildNodeGeometry(buffers: SharedBuffers, begin: number, end: number, params: {
    size: number;
    phase: NodeGeometryPhase;
}): void;
/** The node table of a pyramid whose level 0 has face size `size` (memoised per size). */
export declare function nodeGeometry(size: number): NodeGeometry;
//# sourceMappingURL=node-geometry.d.ts.map