/**
 * Stage 2 kernel for cube sources: area-correct resampling of a source cube onto the level-0 cube. Each
 * destination texel averages k x k stratified points of its footprint, each weighted by the face's
 * solid-angle element (1 + u^2 + v^2)^(-3/2), with bilinear source fetches; the rotation about +Y is
 * applied here. (Equirect sources take the energy-exact splat of kernels/splat.ts.)
 */
import type { SharedBuffers } from '@lightkiln/pool';
export interface ResampleParams {
    readonly size: number;
    /** Supersamples per axis per destination texel. */
    readonly supersample: number;
    /** cos and sin of the rotation angle (positive turns +Z towards +X). */
    readonly rotCos: number;
    readonly rotSin: number;
    /** Source cube face size (both equal). */
    readonly srcWidth: number;
    readonly srcHeight: number;
}
/** buffers.src: source cube RGB float32 of face size srcWidth; buffers.dst: cube RGB float32. */
export declare function resampleCube(buffers: SharedBuffers, begin: number, end: number, params: ResampleParams): void;
//# sourceMappingURL=resample.d.ts.map