/**
 * The preview contact sheet (PNG): every specular level unfolded as a cross with its roughness, the
 * irradiance cube, spheres shaded with the baked assets (split-sum specular F0 * A + B from the DFG table,
 * plus Lambertian diffuse rho E / pi for the dielectric), and the DFG table itself.
 */
import { roughnessToLod } from '../recipe.js';
import { encodePng, linearToSrgb } from '@lightkiln/codecs';
import { cubeFaceToDirection, directionToCubeFace, luminance } from '@lightkiln/math';
import { drawText, textWidth } from './font.js';
const CELL = 40; // cross face size in the sheet
const PAD = 10;
const LABEL = 2; // font scale
const BG = [24, 24, 28];
const INK = [220, 220, 210];
const sel = new Float64Array(3);
const tap = new Float64Array(3);
/**
 * Seamless bilinear lookup of a cube level (faces concatenated, `channels` per texel) in direction d, into
 * out: a tap that falls outside the face is re-projected through its direction onto the neighbouring face,
 * as GPUs do with seamless cube filtering (so even 1 x 1 levels interpolate smoothly).
 */
function sampleCube(out, data, size, channels, x, y, z) {
    directionToCubeFace(sel, 0, x, y, z);
    const face = sel[0];
    const fx = sel[1] * size - 0.5;
    const fy = sel[2] * size - 0.5;
    const x0 = Math.floor(fx);
    const y0 = Math.floor(fy);
    const ax = fx - x0;
    const ay = fy - y0;
    out[0] = 0;
    out[1] = 0;
    out[2] = 0;
    for (let k = 0; k < 4; k++) {
        const tx = x0 + (k & 1);
        const ty = y0 + (k >> 1);
        const w = (k & 1 ? ax : 1 - ax) * (k >> 1 ? ay : 1 - ay);
        if (w === 0)
            continue;
        let f = face;
        let px = tx;
        let py = ty;
        if (tx < 0 || ty < 0 || tx >= size || ty >= size) {
            cubeFaceToDirection(tap, 0, face, (2 * (tx + 0.5)) / size - 1, (2 * (ty + 0.5)) / size - 1);
            directionToCubeFace(sel, 0, tap[0], tap[1], tap[2]);
            f = sel[0];
            px = Math.min(size - 1, Math.max(0, Math.floor(sel[1] * size)));
            py = Math.min(size - 1, Math.max(0, Math.floor(sel[2] * size)));
        }
        const o = ((f * size + py) * size + px) * channels;
        out[0] = out[0] + w * data[o];
        out[1] = out[1] + w * data[o + 1];
        out[2] = out[2] + w * data[o + 2];
    }
}
/**
 * Prefiltered radiance at roughness r as a shader reads it: textureLod at the manifest's roughness-to-LOD
 * mapping (recipe.ts roughnessToLod), trilinear between the two levels around that lod.
 */
function prefiltered(out, input, r, x, y, z) {
    const levels = input.specular.levels;
    const lod = Math.min(levels.length - 1, Math.max(0, roughnessToLod(r, input.roughness)));
    const m = Math.min(Math.floor(lod), levels.length - 1);
    const t = lod - m;
    const a = new Float64Array(3);
    const b = new Float64Array(3);
    const la = levels[m];
    const lb = levels[Math.min(m + 1, levels.length - 1)];
    sampleCube(a, la.data, la.width, input.specular.channels, x, y, z);
    sampleCube(b, lb.data, lb.width, input.specular.channels, x, y, z);
    for (let c = 0; c < 3; c++)
        out[c] = a[c] * (1 - t) + b[c] * t;
}
function lutAt(lut, nDotV, r) {
    const n = lut.width;
    const fx = Math.min(n - 1, Math.max(0, nDotV * n - 0.5));
    const fy = Math.min(n - 1, Math.max(0, r * n - 0.5));
    const x0 = Math.floor(fx);
    const y0 = Math.floor(fy);
    const x1 = Math.min(n - 1, x0 + 1);
    const y1 = Math.min(n - 1, y0 + 1);
    const ax = fx - x0;
    const ay = fy - y0;
    const d = lut.levels[0].data;
    const c = lut.channels;
    const at = (px, py, ch) => d[(py * n + px) * c + ch];
    const v = (ch) => (1 - ay) * ((1 - ax) * at(x0, y0, ch) + ax * at(x1, y0, ch)) + ay * ((1 - ax) * at(x0, y1, ch) + ax * at(x1, y1, ch));
    return [v(0), v(1)];
}
/** Karis 2014 analytic DFG fit ("Physically Based Shading on Mobile", Unreal Engine blog; from memory, coarse), used only when no table was baked. */
function analyticDfg(nDotV, r) {
    const rx = r * -1 + 1;
    const ry = r * -0.0275 + 0.0425;
    const rz = r * -0.572 + 1.04;
    const rw = r * 0.022 - 0.04;
    const a = Math.min(rx * rx, Math.pow(2, -9.28 * nDotV)) * rx + ry;
    return [-1.04 * a + rz, 1.04 * a + rw];
}
/** Renders the contact sheet as PNG bytes. */
export function renderContactSheet(input) {
    const levels = input.specular.levels;
    const columns = 5;
    const crossW = 4 * CELL;
    const crossH = 3 * CELL;
    const labelH = 7 * LABEL + 6;
    const cellW = crossW + PAD;
    const cellH = crossH + labelH + PAD;
    const rows = Math.ceil(levels.length / columns);
    const sphereD = 96;
    const width = PAD + columns * cellW;
    const titleH = 7 * 3 + 2 * PAD;
    const sphereRowH = sphereD + 2 * labelH + PAD;
    const height = titleH + rows * cellH + labelH + crossH + PAD + 2 * sphereRowH + PAD;
    // Linear-light canvas first, tone mapped at the end; labels drawn after.
    const linear = new Float32Array(width * height * 3);
    const mask = new Uint8Array(width * height); // 1 where linear content was drawn
    // Automatic exposure: log-average luminance of the mirror level (Reinhard et al. 2002, eq. 1) to 0.18.
    const l0 = levels[0];
    let logSum = 0;
    const c0 = input.specular.channels;
    const n0 = l0.data.length / c0;
    for (let t = 0; t < n0; t++)
        logSum += Math.log(1e-4 + luminance(l0.data[t * c0], l0.data[t * c0 + 1], l0.data[t * c0 + 2]));
    const exposure = (0.18 / Math.exp(logSum / n0)) * Math.pow(2, input.exposureEv ?? 0);
    const put = (x, y, r, g, b) => {
        if (x < 0 || y < 0 || x >= width || y >= height)
            return;
        const o = (y * width + x) * 3;
        linear[o] = r;
        linear[o + 1] = g;
        linear[o + 2] = b;
        mask[y * width + x] = 1;
    };
    const labels = [[`LIGHTKILN PREVIEW: ${input.probe}`, PAD, PAD]];
    // Cube crosses: +Y above +Z; -X, +Z, +X, -Z across; -Y below (faces as stored, row 0 at the top).
    const place = [[0, 2, 1], [1, 0, 1], [2, 1, 0], [3, 1, 2], [4, 1, 1], [5, 3, 1]];
    const drawCross = (file, level, ox, oy) => {
        const lv = file.levels[level];
        const n = lv.width;
        const ch = file.channels;
        for (const [face, cx, cy] of place) {
            for (let y = 0; y < CELL; y++) {
                for (let x = 0; x < CELL; x++) {
                    // Box filter when the level is larger than the cell, nearest texel when smaller.
                    const sx0 = Math.floor((x * n) / CELL);
                    const sy0 = Math.floor((y * n) / CELL);
                    const sx1 = Math.max(sx0 + 1, Math.floor(((x + 1) * n) / CELL));
                    const sy1 = Math.max(sy0 + 1, Math.floor(((y + 1) * n) / CELL));
                    let r = 0;
                    let g = 0;
                    let b = 0;
                    let k = 0;
                    for (let sy = sy0; sy < sy1; sy++) {
                        for (let sx = sx0; sx < sx1; sx++) {
                            const o = ((face * n + sy) * n + sx) * ch;
                            r += lv.data[o];
                            g += lv.data[o + 1];
                            b += lv.data[o + 2];
                            k++;
                        }
                    }
                    put(ox + cx * CELL + x, oy + cy * CELL + y, r / k, g / k, b / k);
                }
            }
        }
    };
    levels.forEach((_, m) => {
        const ox = PAD + (m % columns) * cellW;
        const oy = titleH + Math.floor(m / columns) * cellH;
        labels.push([`L${m} R=${input.roughness[m].toFixed(2)} ${levels[m].width}`, ox, oy]);
        drawCross(input.specular, m, ox, oy + labelH);
    });
    const row2 = titleH + rows * cellH;
    labels.push(['IRRADIANCE E', PAD, row2]);
    drawCross(input.irradiance, 0, PAD, row2 + labelH);
    if (input.lut !== null) {
        const lut = input.lut;
        const ox = PAD + 2 * cellW;
        labels.push(['DFG (R=A G=B)', ox, row2]);
        const n = lut.width;
        for (let y = 0; y < crossH; y++) {
            for (let x = 0; x < crossH; x++) {
                const o = (Math.floor((y * n) / crossH) * n + Math.floor((x * n) / crossH)) * lut.channels;
                // The table holds albedos in [0, 1]; shown without exposure (divide it back out).
                put(ox + x, row2 + labelH + y, lut.levels[0].data[o] / exposure, lut.levels[0].data[o + 1] / exposure, 0);
            }
        }
    }
    // Spheres, camera at +Z looking towards -Z (v = +Z): dielectric F0 0.04 with grey albedo, and a metal.
    const roughList = [0, 0.25, 0.5, 0.75, 1];
    const materials = [
        { name: 'DIELECTRIC F0 0.04', f0: [0.04, 0.04, 0.04], albedo: 0.5 },
        { name: 'METAL F0 (0.95 0.64 0.54)', f0: [0.95, 0.64, 0.54], albedo: 0 },
    ];
    const ld = new Float64Array(3);
    const e = new Float64Array(3);
    const irr = input.irradiance;
    materials.forEach((mat, row) => {
        const oy = row2 + labelH + crossH + PAD + row * sphereRowH;
        labels.push([mat.name, PAD, oy]);
        roughList.forEach((r, col) => {
            const ox = PAD + col * cellW + (crossW - sphereD) / 2;
            labels.push([`R=${r.toFixed(2)}`, PAD + col * cellW + (crossW - textWidth('R=0.00', LABEL)) / 2, oy + labelH + sphereD + 2]);
            const R = sphereD / 2;
            for (let y = 0; y < sphereD; y++) {
                for (let x = 0; x < sphereD; x++) {
                    const nx = (x + 0.5 - R) / R;
                    const ny = -(y + 0.5 - R) / R;
                    const q = 1 - nx * nx - ny * ny;
                    if (q <= 0)
                        continue;
                    const nz = Math.sqrt(q);
                    // Mirror direction of v = +Z about n: 2 (n.v) n - v.
                    const rx = 2 * nz * nx;
                    const ry = 2 * nz * ny;
                    const rz = 2 * nz * nz - 1;
                    prefiltered(ld, input, r, rx, ry, rz);
                    const [A, B] = input.lut !== null ? lutAt(input.lut, nz, r) : analyticDfg(nz, r);
                    sampleCube(e, irr.levels[0].data, irr.width, irr.channels, nx, ny, nz);
                    const out = [0, 0, 0];
                    for (let c = 0; c < 3; c++) {
                        const spec = mat.f0[c] * A + B;
                        out[c] = ld[c] * spec + mat.albedo * (1 - spec) * (e[c] / Math.PI);
                    }
                    put(ox + x, oy + labelH + y, out[0], out[1], out[2]);
                }
            }
        });
    });
    // Tone map: exposure, Reinhard c / (1 + c) (Reinhard et al. 2002, eq. 3), sRGB (IEC 61966-2-1).
    const rgb = new Uint8Array(width * height * 3);
    for (let p = 0; p < width * height; p++) {
        if (mask[p] === 0) {
            rgb[p * 3] = BG[0];
            rgb[p * 3 + 1] = BG[1];
            rgb[p * 3 + 2] = BG[2];
            continue;
        }
        for (let c = 0; c < 3; c++) {
            const v = Math.max(0, linear[p * 3 + c] * exposure);
            rgb[p * 3 + c] = Math.round(linearToSrgb(v / (1 + v)) * 255);
        }
    }
    labels.forEach(([text, x, y], i) => drawText(rgb, width, height, text, x, y, i === 0 ? 3 : LABEL, INK));
    return encodePng({ width, height, channels: 3, data: rgb }, { text: { Software: 'lightkiln', 'lightkiln:exposure': exposure.toPrecision(6) } });
}
//# sourceMappingURL=sheet.js.map