/**
 * Stages 2 and 3: resampling of the source onto the level-0 cube (rotation applied), then the
 * solid-angle-weighted 2 x 2 reduction down to 1 x 1 faces. All levels live in one shared buffer, beside
 * the luminance centroid of every texel (an offset from its geometric mean direction, face frame) that
 * the hierarchical quadrature of the specular stage weights the light by.
 */
import { cubeFaceSolidAngleTable, cubeTexelCenterDirection } from '@lightkiln/math';
import { sharedFloat32, sharedFloat64, toShared } from '@lightkiln/pool';
import { jobOptions, kernel } from './context.js';
import { nodeGeometryOnPool } from './node-geometry.js';
export function pyramidLayout(size) {
    const sizes = [];
    const offsets = [];
    let length = 0;
    for (let n = size; n >= 1; n >>= 1) {
        sizes.push(n);
        offsets.push(length);
        length += 6 * n * n * 3;
    }
    return { sizes, offsets, length };
}
export function levelView(pyramid, level) {
    const n = pyramid.sizes[level];
    return pyramid.data.subarray(pyramid.offsets[level], pyramid.offsets[level] + 6 * n * n * 3);
}
/**
 * Supersamples per axis of the cube-source resample: enough that the spacing of the points is below the
 * source's texel spacing (a cube texel at the face centre spans 2/size of tangent space).
 */
export function supersampleFactor(source, size) {
    const texelAngle = 2 / size;
    const srcAngle = source.kind === 'equirect' ? (2 * Math.PI) / source.width : 2 / source.size;
    return Math.max(1, Math.min(8, Math.ceil((1.5 * texelAngle) / srcAngle)));
}
/**
 * Sub-cells per source pixel and axis of the equirect splat: even (so the midpoint rule integrates the
 * bilinear reconstruction exactly) and no larger than half a face-centre texel.
 */
export function splatSubcells(width, height, size) {
    const pixelAngle = Math.max(Math.PI / height, (2 * Math.PI) / width);
    return Math.max(2, 2 * Math.ceil((pixelAngle * size) / 2));
}
/**
 * Luminance above which a source pixel counts as a sun for the splat's finer cut: 32 x the source's mean
 * (solid-angle weighted), so at most 1/32 of the sphere qualifies. Rec. 709 luminance (ITU-R BT.709-6).
 */
export function brightThreshold(data, width, height) {
    let sum = 0;
    let weight = 0;
    for (let j = 0; j < height; j++) {
        const w = Math.cos((j * Math.PI) / height) - Math.cos(((j + 1) * Math.PI) / height);
        let row = 0;
        for (let o = j * width * 3, e = o + width * 3; o < e; o += 3)
            row += 0.2126 * data[o] + 0.7152 * data[o + 1] + 0.0722 * data[o + 2];
        sum += w * row;
        weight += w * width;
    }
    const mean = sum / weight;
    return mean > 0 ? 32 * mean : Infinity;
}
/**
 * How many times finer the splat cuts bright pixels: fine sub-cells of at most an eighth of the smallest
 * texel (about 0.94 / size radians wide, at a cube corner), but no more than 64 per pixel and axis (a
 * source far coarser than the cube already has sub-cells that fine), so the bright path never costs more
 * than 1024 x the ordinary one per pixel.
 */
export function brightRefinement(width, height, size, subcells) {
    const pixelAngle = Math.max(Math.PI / height, (2 * Math.PI) / width);
    const wanted = Math.ceil((8.5 * pixelAngle * size) / subcells);
    return Math.max(1, Math.min(wanted, Math.floor(64 / subcells)));
}
export async function buildPyramid(source, size, rotationDeg, ctx) {
    const layout = pyramidLayout(size);
    const data = sharedFloat32(layout.length);
    const centroids = sharedFloat32(layout.length);
    const geometry = await nodeGeometryOnPool(size, ctx);
    const angle = (rotationDeg * Math.PI) / 180;
    const faceItems = size * size;
    if (source.kind === 'equirect') {
        const subcells = splatSubcells(source.width, source.height, size);
        const params = {
            size, srcWidth: source.width, srcHeight: source.height, subcells,
            rotCos: Math.cos(angle), rotSin: Math.sin(angle),
            brightLuminance: brightThreshold(source.data, source.width, source.height),
            brightRefinement: brightRefinement(source.width, source.height, size, subcells),
        };
        // One tile a half face: each scans the part of the source that can land on it (a cap half reads a
        // sixth of the sub-cells, a side half a sixteenth).
        const subcellCount = source.width * source.height * params.subcells * params.subcells;
        const halfItems = faceItems / 2;
        const segments = [];
        for (let h = 0; h < 12; h++) {
            const f = h >> 1;
            segments.push({ begin: h * halfItems, end: (h + 1) * halfItems, costPerItem: ((f === 2 || f === 3 ? 0.16 : 0.07) * subcellCount) / halfItems, rowLength: halfItems, label: `resample face ${f}` });
        }
        await ctx.pool.run({
            kernel: kernel('splatEquirect'),
            buffers: { src: toShared(source.data), pyramid: data, centroids, geometry: geometry.data },
            segments,
            params,
            ...jobOptions(ctx, 'resample'),
        });
    }
    else {
        const params = {
            size, supersample: supersampleFactor(source, size), rotCos: Math.cos(angle), rotSin: Math.sin(angle), srcWidth: source.size, srcHeight: source.size,
        };
        const cost = params.supersample * params.supersample * 4;
        await ctx.pool.run({
            kernel: kernel('resampleCube'),
            buffers: { src: toShared(source.data), dst: data.subarray(0, 6 * faceItems * 3) },
            segments: [0, 1, 2, 3, 4, 5].map((f) => ({ begin: f * faceItems, end: (f + 1) * faceItems, costPerItem: cost, rowLength: size, label: `resample face ${f}` })),
            params,
            ...jobOptions(ctx, 'resample'),
        });
    }
    for (let l = 1; l < layout.sizes.length; l++) {
        const n = layout.sizes[l];
        const reduce = {
            size: n, srcOffset: layout.offsets[l - 1], dstOffset: layout.offsets[l],
            childNodeOffset: layout.offsets[l - 1] / 3, parentNodeOffset: layout.offsets[l] / 3,
            childGeometryOffset: geometry.offsets[l - 1], parentGeometryOffset: geometry.offsets[l],
        };
        await ctx.pool.run({
            kernel: kernel('reducePyramid'),
            buffers: { pyramid: data, centroids, geometry: geometry.data },
            segments: [{ begin: 0, end: 6 * n * n, costPerItem: 60, rowLength: n, label: `pyramid level ${l}` }],
            params: reduce,
            ...jobOptions(ctx, 'pyramid'),
        });
    }
    return { sizes: layout.sizes, offsets: layout.offsets, data, centroids };
}
/** Per source texel (x, y, z, solid angle) of a pyramid level, float64 in shared memory. */
export function sourceDirections(pyramid, level) {
    const n = pyramid.sizes[level];
    const out = sharedFloat64(6 * n * n * 4);
    const d = new Float64Array(3);
    const solid = cubeFaceSolidAngleTable(n);
    for (let f = 0; f < 6; f++) {
        for (let y = 0; y < n; y++) {
            for (let x = 0; x < n; x++) {
                const t = (f * n + y) * n + x;
                cubeTexelCenterDirection(d, 0, f, x, y, n);
                out[t * 4] = d[0];
                out[t * 4 + 1] = d[1];
                out[t * 4 + 2] = d[2];
                out[t * 4 + 3] = solid[y * n + x];
            }
        }
    }
    return out;
}
//# sourceMappingURL=pyramid.js.map