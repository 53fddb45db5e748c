/**
 * Stage 6 kernel: the DFG lookup table. Column i <-> n.v = (i + 0.5) / W, row j <-> perceptual roughness
 * (j + 0.5) / H; R = A, G = B (single scattering, height-correlated Smith, Schlick Fresnel) by the
 * deterministic quadrature of math/dfg-exact.ts (about 1e-6), optional E_avg(r) (midpoint rule over the
 * row's own columns, Kulla & Conty 2017) and cloth albedo (Hammersley, `samples` points).
 */
import { alphaFromPerceptualRoughness, integrateClothAlbedo, integrateDfgExact } from '@lightkiln/math';
/** buffers.dst: float32 table, rows of `width` texels of `channels`; items are texels. */
export function integrateDfgTable(buffers, begin, end, params) {
    const dst = buffers.dst;
    const W = params.width;
    const C = params.channels;
    const ab = new Float64Array(2);
    const scratch = new Float64Array(2);
    for (let row = (begin / W) | 0; row * W < end; row++) {
        const alpha = alphaFromPerceptualRoughness((row + 0.5) / params.height);
        let eavg = 0;
        for (let i = 0; i < W; i++) {
            const mu = (i + 0.5) / W;
            integrateDfgExact(ab, 0, mu, alpha, scratch);
            const o = (row * W + i) * C;
            dst[o] = ab[0];
            dst[o + 1] = ab[1];
            eavg += (ab[0] + ab[1]) * mu;
            if (C === 4)
                dst[o + 3] = params.cloth ? integrateClothAlbedo(mu, alpha, params.samples) : 0;
        }
        if (C === 4) {
            const value = params.multiscatter ? (2 * eavg) / W : 0;
            for (let i = 0; i < W; i++)
                dst[(row * W + i) * C + 2] = value;
        }
    }
}
//# sourceMappingURL=dfg.js.map