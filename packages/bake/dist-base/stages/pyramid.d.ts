/**
 * Stages 2 and 3: resampling of the source onto the level-0 cube (rotation applied), then the
 * solid-angle-weighted 2 x 2 reduction down to 1 x 1 faces. All levels live in one shared buffer, beside
 * the luminance centroid of every texel (an offset from its geometric mean direction, face frame) that
 * the hierarchical quadrature of the specular stage weights the light by.
 */
import { type StageContext } from './context.js';
import type { SourceImage } from './source.js';
export interface Pyramid {
    /** Face size of each level, level 0 first (size, size/2, ..., 1). */
    readonly sizes: readonly number[];
    /** Float offset of each level in data (three floats a texel: the texel offset is offsets / 3). */
    readonly offsets: readonly number[];
    /** RGB texels of every level (shared memory), float32 (the kernels accumulate in float64). */
    readonly data: Float32Array;
    /**
     * Per texel of every level (same order as data), the luminance-weighted mean direction minus the
     * texel's geometric mean direction, in the face frame (C, U, V) of stages/node-geometry.ts; float32.
     */
    readonly centroids: Float32Array;
}
export declare function pyramidLayout(size: number): {
    sizes: number[];
    offsets: number[];
    length: number;
};
export declare function levelView(pyramid: Pyramid, level: number): Float32Array;
/**
 * Supersamples per axis of the cube-source resample: enough that the spacing of the points is below the
 * source's texel spacing (a cube texel at the face centre spans 2/size of tangent space).
 */
export declare function supersampleFactor(source: SourceImage, size: number): number;
/**
 * Sub-cells per source pixel and axis of the equirect splat: even (so the midpoint rule integrates the
 * bilinear reconstruction exactly) and no larger than half a face-centre texel.
 */
export declare function splatSubcells(width: number, height: number, size: number): number;
/**
 * Luminance above which a source pixel counts as a sun for the splat's finer cut: 32 x the source's mean
 * (solid-angle weighted), so at most 1/32 of the sphere qualifies. Rec. 709 luminance (ITU-R BT.709-6).
 */
export declare function brightThreshold(data: Float32Array, width: number, height: number): number;
/**
 * How many times finer the splat cuts bright pixels: fine sub-cells of at most an eighth of the smallest
 * texel (about 0.94 / size radians wide, at a cube corner), but no more than 64 per pixel and axis (a
 * source far coarser than the cube already has sub-cells that fine), so the bright path never costs more
 * than 1024 x the ordinary one per pixel.
 */
export declare function brightRefinement(width: number, height: number, size: number, subcells: number): number;
export declare function buildPyramid(source: SourceImage, size: number, rotationDeg: number, ctx: StageContext): Promise<Pyramid>;
/** Per source texel (x, y, z, solid angle) of a pyramid level, float64 in shared memory. */
export declare function sourceDirections(pyramid: Pyramid, level: number): Float64Array;
//# sourceMappingURL=pyramid.d.ts.map