/**
 * Geometry of every pyramid texel ("node") that the hierarchical quadrature needs, for one face (all six
 * faces are rotations of it, see CUBE_FACE_BASIS): per texel the exact solid angle, the mean direction
 * E[d] over the texel (its first moment divided by the solid angle, in the face frame C, U, V), the length
 * of that mean (1 for a point, less the wider the texel), and the angular radius around it.
 * Level-0 moments come from 4 x 4 Gauss-Legendre points per texel (Abramowitz & Stegun 1964, table 25.4);
 * coarser levels sum their four children, so every level integrates the same function exactly.
 */
import { cubeTexelSolidAngle } from '@lightkiln/math';
import { sharedFloat64 } from '@lightkiln/pool';
import { kernel } from './context.js';
/** Numbers per texel in the table: mean (C, U, V), solid angle, cos rho, sin rho, rho, |mean|. */
export const NODE_STRIDE = 8;
// 4-point Gauss-Legendre nodes and weights on [-1, 1] (Abramowitz & Stegun 1964, table 25.4).
const GL_X = [-0.8611363115940526, -0.3399810435848563, 0.3399810435848563, 0.8611363115940526];
const GL_W = [0.3478548451374538, 0.6521451548625461, 0.6521451548625461, 0.3478548451374538];
const cache = new Map();
/** Face sizes and float offsets of every level's table, and the table's length. */
export function nodeGeometryLayout(size) {
    const sizes = [];
    const offsets = [];
    let length = 0;
    for (let n = size; n >= 1; n >>= 1) {
        sizes.push(n);
        offsets.push(length);
        length += n * n * NODE_STRIDE;
    }
    return { sizes, offsets, length };
}
const pending = new Map();
/**
 * The node table built on the pool (kernel buildNodeGeometry in three phases: level-0 moments by rows,
 * the coarser levels' sums, then means and radii by texels), so the calling thread is free (it decodes
 * the input meanwhile) and the threads share the work (a 1024 table is about 0.5 s on one thread);
 * memoised per size, shared with nodeGeometry().
 */
export function nodeGeometryOnPool(size, ctx) {
    const hit = cache.get(size);
    if (hit !== undefined)
        return Promise.resolve(hit);
    let p = pending.get(size);
    if (p === undefined) {
        const { sizes, offsets, length } = nodeGeometryLayout(size);
        const data = sharedFloat64(length);
        const run = (phase, end, costPerItem) => ctx.pool.run({
            kernel: kernel('buildNodeGeometry'), buffers: { geometry: data }, params: { size, phase },
            segments: [{ begin: 0, end, costPerItem, label: `node geometry (${phase})` }],
        });
        p = (async () => {
            await run('moments', size, 300 * size);
            await run('sums', 1, 1);
            await run('finish', length / NODE_STRIDE, 200);
            const geometry = { sizes, offsets, data };
            if (!cache.has(size))
                cache.set(size, geometry);
            return cache.get(size);
        })().finally(() => pending.delete(size));
        pending.set(size, p);
    }
    return p;
}
/** Kernel: one phase of the table of face size params.size in buffers.geometry (see nodeGeometryOnPool). */
export function buildNodeGeometry(buffers, begin, end, params) {
    const { sizes, offsets } = nodeGeometryLayout(params.size);
    const data = buffers.geometry;
    if (params.phase === 'moments')
        levelZeroMoments(data, params.size, begin, end);
    else if (params.phase === 'sums')
        coarserSums(data, sizes, offsets);
    else
        finishTexels(data, sizes, offsets, begin, end);
}
/** The node table of a pyramid whose level 0 has face size `size` (memoised per size). */
export function nodeGeometry(size) {
    const hit = cache.get(size);
    if (hit !== undefined)
        return hit;
    const { sizes, offsets, length } = nodeGeometryLayout(size);
    const data = sharedFloat64(length);
    fillNodeGeometry(data, size, sizes, offsets);
    const geometry = { sizes, offsets, data };
    cache.set(size, geometry);
    return geometry;
}
function fillNodeGeometry(data, size, sizes, offsets) {
    levelZeroMoments(data, size, 0, size);
    coarserSums(data, sizes, offsets);
    finishTexels(data, sizes, offsets, 0, data.length / NODE_STRIDE);
}
/** Level-0 rows [y0, y1): first moments integral (1, u, v) / r^4 du dv (d = (C + uU + vV) / r, dw = du dv / r^3) and solid angles. */
function levelZeroMoments(data, size, y0, y1) {
    const n0 = size;
    const h = 1 / n0;
    for (let y = y0; y < y1; y++) {
        for (let x = 0; x < n0; x++) {
            const uc = (2 * x + 1) * h - 1;
            const vc = (2 * y + 1) * h - 1;
            let mc = 0;
            let mu = 0;
            let mv = 0;
            for (let j = 0; j < 4; j++) {
                const v = vc + GL_X[j] * h;
                for (let i = 0; i < 4; i++) {
                    const u = uc + GL_X[i] * h;
                    const q = 1 + u * u + v * v;
                    const w = (GL_W[i] * GL_W[j] * h * h) / (q * q);
                    mc += w;
                    mu += u * w;
                    mv += v * w;
                }
            }
            const o = (y * n0 + x) * NODE_STRIDE;
            data[o] = mc;
            data[o + 1] = mu;
            data[o + 2] = mv;
            data[o + 3] = cubeTexelSolidAngle(x, y, n0);
        }
    }
}
/** Coarser levels: moments and solid angles add up over the four children (level by level). */
function coarserSums(data, sizes, offsets) {
    for (let k = 1; k < sizes.length; k++) {
        const n = sizes[k];
        const c = n * 2;
        for (let y = 0; y < n; y++) {
            for (let x = 0; x < n; x++) {
                const o = offsets[k] + (y * n + x) * NODE_STRIDE;
                for (let q = 0; q < 3; q++)
                    data[o + q] = 0;
                for (let dy = 0; dy < 2; dy++) {
                    for (let dx = 0; dx < 2; dx++) {
                        const oc = offsets[k - 1] + ((2 * y + dy) * c + 2 * x + dx) * NODE_STRIDE;
                        for (let q = 0; q < 3; q++)
                            data[o + q] += data[oc + q];
                    }
                }
                data[o + 3] = cubeTexelSolidAngle(x, y, n);
            }
        }
    }
}
/** Texels [t0, t1) of the concatenated levels: moments -> means; radius = the largest angle from the mean direction to a texel corner. */
function finishTexels(data, sizes, offsets, t0, t1) {
    let k = 0;
    for (let t = t0; t < t1; t++) {
        while (k + 1 < sizes.length && t * NODE_STRIDE >= offsets[k + 1])
            k++;
        const n = sizes[k];
        const rem = t - offsets[k] / NODE_STRIDE;
        const y = (rem / n) | 0;
        const x = rem - y * n;
        const o = t * NODE_STRIDE;
        const omega = data[o + 3];
        const mc = data[o] / omega;
        const mu = data[o + 1] / omega;
        const mv = data[o + 2] / omega;
        const len = Math.sqrt(mc * mc + mu * mu + mv * mv);
        let minCos = 1;
        for (let cy = 0; cy < 2; cy++) {
            for (let cx = 0; cx < 2; cx++) {
                const u = (2 * (x + cx)) / n - 1;
                const v = (2 * (y + cy)) / n - 1;
                const cos = (mc + u * mu + v * mv) / (len * Math.sqrt(1 + u * u + v * v));
                if (cos < minCos)
                    minCos = cos;
            }
        }
        const rho = Math.acos(Math.max(-1, Math.min(1, minCos)));
        data[o] = mc;
        data[o + 1] = mu;
        data[o + 2] = mv;
        data[o + 4] = Math.cos(rho);
        data[o + 5] = Math.sin(rho);
        data[o + 6] = rho;
        data[o + 7] = len;
    }
}
//# sourceMappingURL=node-geometry.js.map