/**
 * Stage 6 kernel: the DFG lookup table. Column i <-> n.v = (i + 0.5) / W, row j <-> perceptual roughness
 * (j + 0.5) / H; R = A, G = B (single scattering, height-correlated Smith, Schlick Fresnel) by the
 * deterministic quadrature of math/dfg-exact.ts (about 1e-6), optional E_avg(r) (midpoint rule over the
 * row's own columns, Kulla & Conty 2017) and cloth albedo (Hammersley, `samples` points).
 */
import type { SharedBuffers } from '@lightkiln/pool';
export interface DfgParams {
    readonly width: number;
    readonly height: number;
    readonly samples: number;
    /** Output channels: 2 (A, B) or 4 (A, B, E_avg or 0, cloth or 0). */
    readonly channels: number;
    readonly multiscatter: boolean;
    readonly cloth: boolean;
}
/** buffers.dst: float32 table, rows of `width` texels of `channels`; items are texels. */
export declare function integrateDfgTable(buffers: SharedBuffers, begin: number, end: number, params: DfgParams): void;
//# sourceMappingURL=dfg.d.ts.map