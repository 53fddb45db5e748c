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
import { CUBE_FACE_BASIS } from '@lightkiln/math';
import { NODE_STRIDE } from '../stages/node-geometry.js';
import { scratchFloat64 } from './scratch.js';
import { brightPixels, landBrightPixels, Landing } from './splat-bright.js';
// Polar angle of a cube corner direction (1, 1, 1) / sqrt(3): acos(1 / sqrt(3)).
const CAP_THETA = Math.acos(1 / Math.sqrt(3));
/**
 * buffers.src: equirect RGB float32 (row 0 = +Y); buffers.pyramid: RGB float64, level 0 at offset 0;
 * buffers.centroids: float32 (3 per texel, face frame), level 0 at offset 0; buffers.geometry: the node
 * table of stages/node-geometry.ts, level 0 at offset 0.
 */
export function splatEquirect(buffers, begin, end, params) {
    const src = buffers.src;
    const dst = buffers.pyramid;
    const cent = buffers.centroids;
    const geo = buffers.geometry;
    const n = params.size;
    const perFace = n * n;
    const firstFace = (begin / perFace) | 0;
    const lastFace = ((end - 1) / perFace) | 0;
    for (let face = firstFace; face <= lastFace; face++) {
        splatFace(src, dst, cent, geo, face, Math.max(begin, face * perFace), Math.min(end, (face + 1) * perFace), params);
    }
}
function splatFace(src, dst, cent, geo, face, begin, end, params) {
    const n = params.size;
    const W = params.srcWidth;
    const H = params.srcHeight;
    const s = params.subcells;
    const c = params.rotCos;
    const sn = params.rotSin;
    const B = CUBE_FACE_BASIS;
    const b = face * 9;
    const count = end - begin;
    const omegaSum = scratchFloat64('splat omega', count).fill(0);
    const energy = scratchFloat64('splat energy', count * 3).fill(0);
    const lumMoment = scratchFloat64('splat luminance moment', count * 3).fill(0);
    const geoMoment = scratchFloat64('splat geometric moment', count * 3).fill(0);
    const minimum = scratchFloat64('splat minimum', count * 3).fill(Infinity);
    // Source rows and columns that can land on this face, with margins for the bilinear support and the
    // bright-pixel flags (which look 2 pixels around).
    // A tile of the top half of a face (rows above the middle, t < 0) or of the bottom half scans half of
    // the face's region: upper (y > 0) or lower hemisphere for a side face, the half with z < 0 or z > 0
    // (a half circle of azimuths) for a cap.
    const faceBegin = face * n * n;
    const topOnly = end - faceBegin <= (n * n) / 2;
    const bottomOnly = begin - faceBegin >= (n * n) / 2;
    let theta0 = 0;
    let theta1 = Math.PI;
    let col0 = 0;
    let col1 = W - 1;
    if (face === 2 || face === 3) {
        if (face === 2)
            theta1 = CAP_THETA;
        else
            theta0 = Math.PI - CAP_THETA;
        if (topOnly || bottomOnly) {
            // t = z on +Y and -z on -Y; z of the turned direction is sin(theta) cos(phi - angle) with phi the
            // source azimuth below, so z > 0 on azimuths angle +- pi / 2.
            const wantPositiveZ = (face === 2) === bottomOnly;
            const angle = Math.atan2(sn, c);
            const centre = ((angle + (wantPositiveZ ? 0 : Math.PI)) / (2 * Math.PI)) * W - 0.5;
            col0 = Math.floor(centre - W / 4) - 3;
            col1 = Math.ceil(centre + W / 4) + 3;
        }
    }
    else {
        // A side face reaches up to its top edge midpoints, (0, 1, 1) / sqrt(2) for +Z: theta = pi / 4.
        theta0 = topOnly ? Math.PI / 4 : bottomOnly ? Math.PI / 2 : Math.PI / 4;
        theta1 = topOnly ? Math.PI / 2 : 3 * Math.PI / 4;
        // Face axis in the cube frame, back to the source frame (R(-angle)), then its equirect azimuth.
        const ax = B[b];
        const az = B[b + 2];
        const sx = ax * c - az * sn;
        const sz = ax * sn + az * c;
        const phi = Math.atan2(-sx, sz); // phi of the source parametrisation below: x = -sin phi, z = cos phi
        const centre = (phi < 0 ? phi + 2 * Math.PI : phi) / (2 * Math.PI) * W;
        col0 = Math.floor(centre - W / 8) - 3;
        col1 = Math.ceil(centre + W / 8) + 3;
    }
    // Margins of 3 pixels: the bright flags of a landing pixel look 2 pixels further.
    const row0 = Math.max(0, Math.floor((theta0 / Math.PI) * H) - 3);
    const row1 = Math.min(H - 1, Math.ceil((theta1 / Math.PI) * H) + 3);
    const cols = col1 - col0 + 1;
    const subCols = cols * s;
    const sinPhi = new Float64Array(subCols);
    const cosPhi = new Float64Array(subCols);
    // Per sub-column: azimuth, and the bilinear columns and weight (wrapping in longitude).
    const colA = new Int32Array(subCols);
    const colB = new Int32Array(subCols);
    const colW = new Float64Array(subCols);
    for (let k = 0; k < subCols; k++) {
        const phi = (2 * Math.PI * (col0 + (k + 0.5) / s)) / W;
        sinPhi[k] = Math.sin(phi);
        cosPhi[k] = Math.cos(phi);
        const fu = col0 + (k + 0.5) / s - 0.5;
        const xf = Math.floor(fu);
        let xa = xf % W;
        if (xa < 0)
            xa += W;
        colA[k] = xa * 3;
        colB[k] = (xa + 1 >= W ? 0 : xa + 1) * 3;
        colW[k] = fu - xf;
    }
    const dPhi = (2 * Math.PI) / (W * s);
    const half = n / 2;
    const acc = new Landing(face, n, begin, count, omegaSum, energy, minimum, lumMoment, geoMoment);
    const bright = brightPixels(src, W, row0, row1, col0, col1, params.brightLuminance);
    const colPixel = new Int32Array(subCols);
    for (let k = 0; k < subCols; k++)
        colPixel[k] = (k / s) | 0;
    for (let j = row0; j <= row1; j++) {
        const brightRow = bright !== null && bright.rows[j - row0] === 1 ? (j - row0) * cols : -1;
        for (let sj = 0; sj < s; sj++) {
            const ta = ((j + sj / s) * Math.PI) / H;
            const tb = ((j + (sj + 1) / s) * Math.PI) / H;
            const theta = ((j + (sj + 0.5) / s) * Math.PI) / H;
            const omega = dPhi * (Math.cos(ta) - Math.cos(tb));
            const sinT = Math.sin(theta);
            const dy = Math.cos(theta);
            // Bilinear rows and weight (pixel centres at j + 0.5; clamped at the poles).
            let fv = j + (sj + 0.5) / s - 0.5;
            if (fv < 0)
                fv = 0;
            else if (fv > H - 1)
                fv = H - 1;
            const y0 = fv | 0;
            const y1 = y0 + 1 < H ? y0 + 1 : y0;
            const ay = fv - y0;
            const row0Base = y0 * W * 3;
            const row1Base = y1 * W * 3;
            for (let k = 0; k < subCols; k++) {
                // Bright pixels are cut finer below.
                if (brightRow >= 0 && bright.flags[brightRow + colPixel[k]] === 1)
                    continue;
                // Source direction (x = -sin theta sin phi, y = cos theta, z = sin theta cos phi), then R(angle).
                const sx = -sinT * sinPhi[k];
                const sz = sinT * cosPhi[k];
                // Bilinear source value at the sub-cell centre (wraps in longitude).
                const axw = colW[k];
                const i00 = row0Base + colA[k];
                const i10 = row0Base + colB[k];
                const i01 = row1Base + colA[k];
                const i11 = row1Base + colB[k];
                const w00 = (1 - axw) * (1 - ay);
                const w10 = axw * (1 - ay);
                const w01 = (1 - axw) * ay;
                const w11 = axw * ay;
                const r = src[i00] * w00 + src[i10] * w10 + src[i01] * w01 + src[i11] * w11;
                const g = src[i00 + 1] * w00 + src[i10 + 1] * w10 + src[i01 + 1] * w01 + src[i11 + 1] * w11;
                const bl = src[i00 + 2] * w00 + src[i10 + 2] * w10 + src[i01 + 2] * w01 + src[i11 + 2] * w11;
                // From here to the end of the loop: Landing.land inlined (a call per sub-cell made the splat
                // 1.5 x slower, measured); the splat test pins both to the same result.
                const dx = sx * c + sz * sn;
                const dz = -sx * sn + sz * c;
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
                if (f !== face)
                    continue;
                let tx = ((sc / ma + 1) * half) | 0;
                let ty = ((tc / ma + 1) * half) | 0;
                if (tx >= n)
                    tx = n - 1;
                if (ty >= n)
                    ty = n - 1;
                const local = face * n * n + ty * n + tx - begin;
                if (local < 0 || local >= count)
                    continue;
                const o = local * 3;
                omegaSum[local] += omega;
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
                lumMoment[o] += yo * dx;
                lumMoment[o + 1] += yo * dy;
                lumMoment[o + 2] += yo * dz;
                geoMoment[o] += omega * dx;
                geoMoment[o + 1] += omega * dy;
                geoMoment[o + 2] += omega * dz;
            }
        }
    }
    if (bright !== null)
        landBrightPixels(acc, src, W, H, row0, col0, cols, bright, s * params.brightRefinement, c, sn);
    // The floor of the footprint fill: the per-channel minimum over the texel and its in-face neighbours,
    // so a texel inside a sun whose sub-cells over- or undershoot its footprint trades sky-level radiance
    // with its neighbour, never sun-level (the sun's own energy stays exactly where its sub-cells landed).
    const floor = scratchFloat64('splat floor', count * 3);
    for (let local = 0; local < count; local++) {
        const rem = begin + local - face * n * n;
        const ty = (rem / n) | 0;
        const tx = rem - ty * n;
        for (let ch = 0; ch < 3; ch++) {
            let m = Infinity;
            for (let yy = ty > 0 ? ty - 1 : 0; yy <= ty + 1 && yy < n; yy++) {
                for (let xx = tx > 0 ? tx - 1 : 0; xx <= tx + 1 && xx < n; xx++) {
                    const other = face * n * n + yy * n + xx - begin;
                    if (other >= 0 && other < count) {
                        const v = minimum[other * 3 + ch];
                        if (v < m)
                            m = v;
                    }
                }
            }
            floor[local * 3 + ch] = m;
        }
    }
    // Finish: fill the footprint the sub-cells missed with the floor, move moments to the face frame.
    for (let local = 0; local < count; local++) {
        const item = begin + local;
        const rem = item - face * n * n;
        const gi = rem * NODE_STRIDE;
        const omegaExact = geo[gi + 3];
        const o = local * 3;
        const po = item * 3;
        const missing = omegaExact - omegaSum[local];
        if (omegaSum[local] === 0) {
            // No sub-cell landed here (a small corner texel under a coarse source): the source at its centre.
            centreSample(dst, po, src, W, H, geo[gi], geo[gi + 1], geo[gi + 2], b, c, sn);
            cent[po] = 0;
            cent[po + 1] = 0;
            cent[po + 2] = 0;
            continue;
        }
        // The footprint the sub-cells missed (or overshot) is filled (or emptied) at the texel's own landed
        // mean where the neighbourhood is smooth (its mean within 1.5 x the floor: a gradient then leaves no
        // bias, where the floor would have biased coarse sources by up to 4% at level 0), at the floor where
        // a sun's light landed (mean 3 x the floor or more), blended linearly in between.
        const invLanded = 1 / omegaSum[local];
        const yLanded = (0.2126 * energy[o] + 0.7152 * energy[o + 1] + 0.0722 * energy[o + 2]) * invLanded;
        const yFloor = 0.2126 * floor[o] + 0.7152 * floor[o + 1] + 0.0722 * floor[o + 2];
        let own = 0;
        if (yLanded <= 1.5 * yFloor)
            own = 1;
        else if (yLanded < 3 * yFloor)
            own = (3 * yFloor - yLanded) / (1.5 * yFloor);
        const fr = own * energy[o] * invLanded + (1 - own) * floor[o];
        const fg = own * energy[o + 1] * invLanded + (1 - own) * floor[o + 1];
        const fb = own * energy[o + 2] * invLanded + (1 - own) * floor[o + 2];
        const r = (energy[o] + missing * fr) / omegaExact;
        const g = (energy[o + 1] + missing * fg) / omegaExact;
        const bl = (energy[o + 2] + missing * fb) / omegaExact;
        dst[po] = r;
        dst[po + 1] = g;
        dst[po + 2] = bl;
        // The filled (or emptied) footprint's light in the luminance moments: at the fill value, with the
        // footprint's geometric moment (the texel's minus what the sub-cells covered).
        const yRef = 0.2126 * fr + 0.7152 * fg + 0.0722 * fb;
        const yMean = 0.2126 * r + 0.7152 * g + 0.0722 * bl;
        if (!(yMean > 0)) {
            cent[po] = 0;
            cent[po + 1] = 0;
            cent[po + 2] = 0;
            continue;
        }
        // Texel geometric mean (face frame) times its solid angle, minus what the sub-cells covered.
        const mc = geo[gi];
        const mu = geo[gi + 1];
        const mv = geo[gi + 2];
        const gx = geoMoment[o];
        const gy = geoMoment[o + 1];
        const gz = geoMoment[o + 2];
        const gc = gx * B[b] + gy * B[b + 1] + gz * B[b + 2];
        const gu = gx * B[b + 3] + gy * B[b + 4] + gz * B[b + 5];
        const gv = gx * B[b + 6] + gy * B[b + 7] + gz * B[b + 8];
        const lx = lumMoment[o];
        const ly = lumMoment[o + 1];
        const lz = lumMoment[o + 2];
        const lc = lx * B[b] + ly * B[b + 1] + lz * B[b + 2] + yRef * (omegaExact * mc - gc);
        const lu = lx * B[b + 3] + ly * B[b + 4] + lz * B[b + 5] + yRef * (omegaExact * mu - gu);
        const lv = lx * B[b + 6] + ly * B[b + 7] + lz * B[b + 8] + yRef * (omegaExact * mv - gv);
        const inv = 1 / (yMean * omegaExact);
        cent[po] = lc * inv - mc;
        cent[po + 1] = lu * inv - mu;
        cent[po + 2] = lv * inv - mv;
    }
}
/** Bilinear source value in the direction of face-frame vector (mc, mu, mv) of face basis b. */
function centreSample(dst, po, src, W, H, mc, mu, mv, b, c, sn) {
    const B = CUBE_FACE_BASIS;
    const dx = B[b] * mc + B[b + 3] * mu + B[b + 6] * mv;
    const dy = B[b + 1] * mc + B[b + 4] * mu + B[b + 7] * mv;
    const dz = B[b + 2] * mc + B[b + 5] * mu + B[b + 8] * mv;
    const len = Math.sqrt(dx * dx + dy * dy + dz * dz);
    // Source direction R(-angle) d, then the equirect mapping (u = 0.5 + atan2(x, -z) / 2 pi, v = acos(y) / pi).
    const sx = dx * c - dz * sn;
    const sz = dx * sn + dz * c;
    const yy = dy / len;
    let fu = (0.5 + Math.atan2(sx, -sz) / (2 * Math.PI)) * W - 0.5;
    let fv = (Math.acos(yy > 1 ? 1 : yy < -1 ? -1 : yy) / Math.PI) * H - 0.5;
    if (fv < 0)
        fv = 0;
    else if (fv > H - 1)
        fv = H - 1;
    if (fu < 0)
        fu += W;
    const x0 = Math.floor(fu);
    const y0 = fv | 0;
    const ax = fu - x0;
    const ay = fv - y0;
    const xa = x0 >= W ? x0 - W : x0;
    const xb = xa + 1 >= W ? 0 : xa + 1;
    const y1 = y0 + 1 < H ? y0 + 1 : y0;
    for (let ch = 0; ch < 3; ch++) {
        dst[po + ch] = (1 - ax) * (1 - ay) * src[(y0 * W + xa) * 3 + ch] + ax * (1 - ay) * src[(y0 * W + xb) * 3 + ch]
            + (1 - ax) * ay * src[(y1 * W + xa) * 3 + ch] + ax * ay * src[(y1 * W + xb) * 3 + ch];
    }
}
//# sourceMappingURL=splat.js.map