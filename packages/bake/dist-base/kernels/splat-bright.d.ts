/**
 * The equirect splat's path for bright pixels (kernels/splat.ts): which pixels count as bright, the
 * accumulators a sub-cell lands in, and the finer cut that carries each bright pixel as its own square.
 */
/** Accumulators of one tile: where a sub-cell lands and what it brings (one object per tile, not per sub-cell). */
export declare class Landing {
    private readonly face;
    private readonly n;
    private readonly begin;
    private readonly count;
    private readonly omegaSum;
    private readonly energy;
    private readonly minimum;
    private readonly lumMoment;
    private readonly geoMoment;
    private readonly half;
    constructor(face: number, n: number, begin: number, count: number, omegaSum: Float64Array, energy: Float64Array, minimum: Float64Array, lumMoment: Float64Array, geoMoment: Float64Array);
    /** The texel (face * n * n + y * n + x) that holds direction (dx, dy, dz), cube frame. */
    texelOf(dx: number, dy: number, dz: number): number;
    /** Adds a sub-cell of solid angle omega, direction (dx, dy, dz) (cube frame) and radiance (r, g, b) to its texel, if the tile holds it. */
    land(dx: number, dy: number, dz: number, omega: number, r: number, g: number, bl: number): void;
    /** As land, into a known texel. */
    landIn(texel: number, dx: number, dy: number, dz: number, omega: number, r: number, g: number, bl: number): void;
}
export interface BrightPixels {
    /** One flag per pixel of the tile's source window (rows row0.., columns col0.. wrapped), 1 = bright or within 2 pixels of one. */
    readonly flags: Uint8Array;
    /** One flag per window row: 1 when the row holds a flagged pixel. */
    readonly rows: Uint8Array;
}
/**
 * Flags the window's pixels above the luminance threshold and those within 2 pixels of one: the bilinear
 * reconstruction of an unflagged pixel then reads no bright pixel, and the flagged ring's outer pixels are
 * close to the surrounding sky, so the two reconstructions meet without carrying sun light twice. Null
 * when none.
 */
export declare function brightPixels(src: Float32Array, W: number, row0: number, row1: number, col0: number, col1: number, threshold: number): BrightPixels | null;
/**
 * The flagged pixels, each cut into fine x fine sub-cells (even: the midpoint rule stays exact on the
 * pixel square) that carry the pixel's own value. A sub-cell whose corners fall in different texels is
 * split further (2 x 2, up to 4 times), so a sun's light is shared between texels by area to within a
 * 1/16 sliver of a sub-cell: texels inside a sun then trade almost nothing through the footprint fill.
 */
export declare function landBrightPixels(acc: Landing, src: Float32Array, W: number, H: number, row0: number, col0: number, cols: number, bright: BrightPixels, fine: number, c: number, sn: number): void;
//# sourceMappingURL=splat-bright.d.ts.map