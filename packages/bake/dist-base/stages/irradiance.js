/**
 * Stage 5: diffuse irradiance. SH9 projection of the level-0 cube with exact texel solid angles
 * (Ramamoorthi & Hanrahan 2001), optional ringing window (Sloan 2008), and an irradiance cube holding E
 * (not E / pi) by direct cosine convolution of a pyramid level or reconstructed from the SH9.
 */
import { applySh9BandWeights, convolveSh9Lambert, cubeTexelCenterDirection, evalSh9Rgb, sh9WindowWeights, } from '@lightkiln/math';
import { sharedFloat32, sharedFloat64 } from '@lightkiln/pool';
import { jobOptions, kernel } from './context.js';
import { nodeGeometryOnPool } from './node-geometry.js';
import { sourceDirections } from './pyramid.js';
/**
 * Projects a cube level onto SH9: L_lm = sum_texels L Y_lm dOmega (exact texel solid angles), as per-row
 * partial sums on the pool (kernels/sh-project.ts) added here in row order.
 */
export async function projectSh9(pyramid, level, window, windowWidth, ctx) {
    const n = pyramid.sizes[level];
    const rows = sharedFloat64(6 * n * 27);
    const geometry = await nodeGeometryOnPool(pyramid.sizes[0], ctx);
    await ctx.pool.run({
        kernel: kernel('projectSh9Rows'),
        buffers: { pyramid: pyramid.data, geometry: geometry.data, dst: rows },
        segments: [{ begin: 0, end: 6 * n, costPerItem: 20 * n, label: 'sh9 projection' }],
        params: { size: n, offset: pyramid.offsets[level], geometryOffset: geometry.offsets[level] },
        ...jobOptions(ctx, 'irradiance'),
    });
    const radiance = new Float64Array(27);
    for (let row = 0; row < 6 * n; row++)
        for (let k = 0; k < 27; k++)
            radiance[k] = radiance[k] + rows[row * 27 + k];
    const weights = new Float64Array(3);
    sh9WindowWeights(weights, window, windowWidth);
    applySh9BandWeights(radiance, weights);
    const irradiance = new Float64Array(27);
    convolveSh9Lambert(irradiance, radiance);
    return { radiance, irradiance };
}
/** The source level used for the direct convolution: the largest with faces of at most 64 texels. */
export function convolutionSourceLevel(pyramid) {
    let level = 0;
    while (pyramid.sizes[level] > 64)
        level++;
    return level;
}
/**
 * The source table of kernels/convolve.ts convolveIrradiance for a pyramid level: per texel its centre
 * direction, exact solid angle, and RGB radiance times that solid angle (eight float64, shared memory).
 */
export function convolutionSource(pyramid, level) {
    const n = pyramid.sizes[level];
    const geometry = sourceDirections(pyramid, level);
    const src0 = pyramid.offsets[level];
    const out = sharedFloat64(6 * n * n * 8);
    for (let j = 0; j < 6 * n * n; j++) {
        const w = geometry[4 * j + 3];
        out[8 * j] = geometry[4 * j];
        out[8 * j + 1] = geometry[4 * j + 1];
        out[8 * j + 2] = geometry[4 * j + 2];
        out[8 * j + 3] = w;
        out[8 * j + 4] = pyramid.data[src0 + 3 * j] * w;
        out[8 * j + 5] = pyramid.data[src0 + 3 * j + 1] * w;
        out[8 * j + 6] = pyramid.data[src0 + 3 * j + 2] * w;
    }
    return out;
}
/** The irradiance cube; `shResult` (called only when the cube is reconstructed from SH9) gives the projection. */
export async function irradianceCube(pyramid, size, source, shResult, ctx) {
    const texels = 6 * size * size;
    if (source === 'sh9') {
        const sh = await shResult();
        const out = new Float32Array(texels * 3);
        const d = new Float64Array(3);
        const e = new Float64Array(3);
        for (let f = 0; f < 6; f++) {
            for (let y = 0; y < size; y++) {
                for (let x = 0; x < size; x++) {
                    cubeTexelCenterDirection(d, 0, f, x, y, size);
                    evalSh9Rgb(e, 0, sh.irradiance, d[0], d[1], d[2]);
                    const t = ((f * size + y) * size + x) * 3;
                    out[t] = e[0];
                    out[t + 1] = e[1];
                    out[t + 2] = e[2];
                }
            }
        }
        return out;
    }
    const level = convolutionSourceLevel(pyramid);
    const n = pyramid.sizes[level];
    const dirs = convolutionSource(pyramid, level);
    const dst = sharedFloat32(texels * 3);
    const params = { srcOffset: pyramid.offsets[level], srcTexels: 6 * n * n, size, levelBegin: 0, dstOffset: 0 };
    await ctx.pool.run({
        kernel: kernel('convolveIrradiance'),
        buffers: { srcDirs: dirs, dst },
        segments: [0, 1, 2, 3, 4, 5].map((f) => ({ begin: f * size * size, end: (f + 1) * size * size, costPerItem: 6 * n * n, rowLength: size, label: `irradiance face ${f}` })),
        params,
        ...jobOptions(ctx, 'irradiance'),
    });
    return dst.slice();
}
//# sourceMappingURL=irradiance.js.map