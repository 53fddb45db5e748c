/**
 * The equirect splat's path for bright pixels (kernels/splat.ts): which pixels count as bright, the
 * accumulators a sub-cell lands in, and the finer cut that carries each bright pixel as its own square.
 */
import { scratchUint8 } from './scratch.js';
/** Accumulators of one tile: where a sub-cell lands and what it brings (one object per tile, not per sub-cell). */
export class Landing {
    face;
    n;
    begin;
    count;
    omegaSum;
    energy;
    minimum;
    lumMoment;
    geoMoment;
    half;
    constructor(face, n, begin, count, omegaSum, energy, minimum, lumMoment, geoMoment) {
        this.face = face;
        this.n = n;
        this.begin = begin;
        this.count = count;
        this.omegaSum = omegaSum;
        this.energy = energy;
        this.minimum = minimum;
        this.lumMoment = lumMoment;
        this.geoMoment = geoMoment;
        this.half = n / 2;
    }
    /** The texel (face * n * n + y * n + x) that holds direction (dx, dy, dz), cube frame. */
    texelOf(dx, dy, dz) {
        // Face selection (ties: z, then y, then x), as the other kernels.
        const ax = dx < 0 ? -dx : dx;
        const ayy = dy < 0 ? -dy : dy;
        const az = dz < 0 ? -dz : dz;
        let f;
        let sc;
        let tc;
        let ma;
        if (az >= ayy && az >= ax) {
            ma = az;
            tc = -dy;
            if (dz >= 0) {
                f = 4;
                sc = dx;
            }
            else {
                f = 5;
                sc = -dx;
            }
        }
        else if (ayy >= ax) {
            ma = ayy;
            sc = dx;
            if (dy >= 0) {
                f = 2;
                tc = dz;
            }
            else {
                f = 3;
                tc = -dz;
            }
        }
        else {
            ma = ax;
            tc = -dy;
            if (dx >= 0) {
                f = 0;
                sc = -dz;
            }
            else {
                f = 1;
                sc = dz;
            }
        }
        const n = this.n;
        let tx = ((sc / ma + 1) * this.half) | 0;
        let ty = ((tc / ma + 1) * this.half) | 0;
        if (tx >= n)
            tx = n - 1;
        if (ty >= n)
            ty = n - 1;
        return f * n * n + ty * n + tx;
    }
    /** Adds a sub-cell of solid angle omega, direction (dx, dy, dz) (cube frame) and radiance (r, g, b) to its texel, if the tile holds it. */
    land(dx, dy, dz, omega, r, g, bl) {
        this.landIn(this.texelOf(dx, dy, dz), dx, dy, dz, omega, r, g, bl);
    }
    /** As land, into a known texel. */
    landIn(texel, dx, dy, dz, omega, r, g, bl) {
        const n = this.n;
        if (((texel / (n * n)) | 0) !== this.face)
            return;
        const local = texel - this.begin;
        if (local < 0 || local >= this.count)
            return;
        const o = local * 3;
        const energy = this.energy;
        const minimum = this.minimum;
        this.omegaSum[local] += omega;
        energy[o] += r * omega;
        energy[o + 1] += g * omega;
        energy[o + 2] += bl * omega;
        if (r < minimum[o])
            minimum[o] = r;
        if (g < minimum[o + 1])
            minimum[o + 1] = g;
        if (bl < minimum[o + 2])
            minimum[o + 2] = bl;
        const yo = (0.2126 * r + 0.7152 * g + 0.0722 * bl) * omega;
        const lum = this.lumMoment;
        const geom = this.geoMoment;
        lum[o] += yo * dx;
        lum[o + 1] += yo * dy;
        lum[o + 2] += yo * dz;
        geom[o] += omega * dx;
        geom[o + 1] += omega * dy;
        geom[o + 2] += omega * dz;
    }
}
/**
 * Flags the window's pixels above the luminance threshold and those within 2 pixels of one: the bilinear
 * reconstruction of an unflagged pixel then reads no bright pixel, and the flagged ring's outer pixels are
 * close to the surrounding sky, so the two reconstructions meet without carrying sun light twice. Null
 * when none.
 */
export function brightPixels(src, W, row0, row1, col0, col1, threshold) {
    if (!(threshold < Infinity))
        return null;
    const rowsN = row1 - row0 + 1;
    const cols = col1 - col0 + 1;
    let flags = null;
    for (let j = 0; j < rowsN; j++) {
        const base = (row0 + j) * W;
        let x = col0 % W;
        if (x < 0)
            x += W;
        for (let i = 0; i < cols; i++, x = x + 1 === W ? 0 : x + 1) {
            const o = (base + x) * 3;
            if (0.2126 * src[o] + 0.7152 * src[o + 1] + 0.0722 * src[o + 2] > threshold) {
                flags ??= scratchUint8('bright flags', rowsN * cols).fill(0);
                for (let jj = j > 1 ? j - 2 : 0; jj <= j + 2 && jj < rowsN; jj++) {
                    for (let ii = i > 1 ? i - 2 : 0; ii <= i + 2 && ii < cols; ii++)
                        flags[jj * cols + ii] = 1;
                }
            }
        }
    }
    if (flags === null)
        return null;
    const rows = scratchUint8('bright rows', rowsN).fill(0);
    for (let j = 0; j < rowsN; j++) {
        for (let i = 0; i < cols; i++) {
            if (flags[j * cols + i] === 1) {
                rows[j] = 1;
                break;
            }
        }
    }
    return { flags, rows };
}
/**
 * The flagged pixels, each cut into fine x fine sub-cells (even: the midpoint rule stays exact on the
 * pixel square) that carry the pixel's own value. A sub-cell whose corners fall in different texels is
 * split further (2 x 2, up to 4 times), so a sun's light is shared between texels by area to within a
 * 1/16 sliver of a sub-cell: texels inside a sun then trade almost nothing through the footprint fill.
 */
export function landBrightPixels(acc, src, W, H, row0, col0, cols, bright, fine, c, sn) {
    for (let j = 0; j < bright.rows.length; j++) {
        if (bright.rows[j] !== 1)
            continue;
        const row = row0 + j;
        for (let i = 0; i < cols; i++) {
            if (bright.flags[j * cols + i] !== 1)
                continue;
            const col = col0 + i;
            let x = col % W;
            if (x < 0)
                x += W;
            const p = (row * W + x) * 3;
            const r = src[p];
            const g = src[p + 1];
            const b = src[p + 2];
            for (let sj = 0; sj < fine; sj++) {
                const ta = ((row + sj / fine) * Math.PI) / H;
                const tb = ((row + (sj + 1) / fine) * Math.PI) / H;
                for (let sk = 0; sk < fine; sk++) {
                    const pa = (2 * Math.PI * (col + sk / fine)) / W;
                    const pb = (2 * Math.PI * (col + (sk + 1) / fine)) / W;
                    landCell(acc, ta, tb, pa, pb, 4, r, g, b, c, sn);
                }
            }
        }
    }
}
/** The texel of source direction (theta, phi) turned by the rotation (x = -sin theta sin phi, y = cos theta, z = sin theta cos phi). */
function texelAt(acc, theta, phi, c, sn) {
    const st = Math.sin(theta);
    const sx = -st * Math.sin(phi);
    const sz = st * Math.cos(phi);
    return acc.texelOf(sx * c + sz * sn, Math.cos(theta), -sx * sn + sz * c);
}
/** One cell [ta, tb] x [pa, pb] of constant radiance: whole into its texel, or split while its corners disagree. */
function landCell(acc, ta, tb, pa, pb, depth, r, g, b, c, sn) {
    const tm = 0.5 * (ta + tb);
    const pm = 0.5 * (pa + pb);
    const st = Math.sin(tm);
    const sx = -st * Math.sin(pm);
    const sz = st * Math.cos(pm);
    const dx = sx * c + sz * sn;
    const dy = Math.cos(tm);
    const dz = -sx * sn + sz * c;
    const centre = acc.texelOf(dx, dy, dz);
    if (depth > 0 && (texelAt(acc, ta, pa, c, sn) !== centre || texelAt(acc, ta, pb, c, sn) !== centre || texelAt(acc, tb, pa, c, sn) !== centre || texelAt(acc, tb, pb, c, sn) !== centre)) {
        landCell(acc, ta, tm, pa, pm, depth - 1, r, g, b, c, sn);
        landCell(acc, ta, tm, pm, pb, depth - 1, r, g, b, c, sn);
        landCell(acc, tm, tb, pa, pm, depth - 1, r, g, b, c, sn);
        landCell(acc, tm, tb, pm, pb, depth - 1, r, g, b, c, sn);
        return;
    }
    acc.landIn(centre, dx, dy, dz, (pb - pa) * (Math.cos(ta) - Math.cos(tb)), r, g, b);
}
//# sourceMappingURL=splat-bright.js.map