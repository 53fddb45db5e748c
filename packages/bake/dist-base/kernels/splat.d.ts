/**
 * Stage 2 kernel for equirectangular sources: energy-exact resampling onto the level-0 cube, plus the
 * luminance centroid of every texel. Each source pixel is cut into s x s sub-cells (s even); a sub-cell
 * carries the source's bilinear reconstruction at its centre (with s even the midpoint rule integrates
 * that reconstruction exactly) over its exact solid angle (2 pi / (W s)) (cos theta_a - cos theta_b), and
 * lands whole in the texel that holds its centre. A texel's value is the energy that landed in it plus a
 * fill value over the part of its footprint the sub-cells missed (or minus it over the part they
 * overshot), divided by its exact solid angle. The fill is the texel's own landed mean where its
 * neighbourhood is smooth (no bias on a gradient; the neighbourhood minimum used alone put level 0 of a
 * 512-wide source 4% off at size 64) and the per-channel minimum of its and its neighbours' sub-cells where
 * a sun landed (so a bright source smaller than a texel keeps its energy): a constant sky stays exact. The luminance-weighted mean direction of
 * the texel is stored as an offset from the texel's geometric mean direction (face frame, float32), so a
 * sun is weighted by the prefilter where it really is, not at the texel centre.
 *
 * Bright pixels (a sun: above brightLuminance) and their neighbours take a second path: cut
 * brightRefinement times finer, each fine sub-cell carrying the pixel's own value (the pixel square, not
 * the bilinear reconstruction, which would spread a sun a few pixels wide over a tent twice its width).
 * A texel inside a sun then trades at most a thin sliver of sun-level light with its neighbours through
 * the footprint fill, so the sun keeps its energy (it lost 0.26% at 128 from a 1024-wide source with
 * whole coarse sub-cells) and its spread is the image's (level 1 was 0.6-0.8% off at the sun's peak).
 *
 * Items are level-0 texels; a tile must cover a whole face or the top or bottom half of one (the stage
 * sets rowLength to half a face), since every tile scans the part of the source that can land on it.
 */
import type { SharedBuffers } from '@lightkiln/pool';
export interface SplatParams {
    readonly size: number;
    readonly srcWidth: number;
    readonly srcHeight: number;
    /** Sub-cells per source pixel and axis (even). */
    readonly subcells: number;
    /** cos and sin of the rotation angle (positive turns +Z towards +X). */
    readonly rotCos: number;
    readonly rotSin: number;
    /**
     * Pixels brighter than this luminance (a sun), and their neighbours, are cut brightRefinement times
     * finer: a texel inside a sun then trades at most a thin sliver of sun-level radiance with its
     * neighbours instead of whole sub-cells (Infinity turns it off).
     */
    readonly brightLuminance: number;
    readonly brightRefinement: number;
}
/**
 * buffers.src: equirect RGB float32 (row 0 = +Y); buffers.pyramid: RGB float64, level 0 at offset 0;
 * buffers.centroids: float32 (3 per texel, face frame), level 0 at offset 0; buffers.geometry: the node
 * table of stages/node-geometry.ts, level 0 at offset 0.
 */
export declare function splatEquirect(buffers: SharedBuffers, begin: number, end: number, params: SplatParams): void;
//# sourceMappingURL=splat.d.ts.map