// Generates the demo environment: a high-altitude observatory at dusk, as a Radiance .hdr panorama
// (equirectangular, lightkiln's convention: image centre looks towards -Z, row 0 is the zenith).
//   node make-sky.mjs <out.hdr> [width]
// The scene is ours: a graded dusk sky, a small and very bright sun just above the western horizon,
// a warm lit plateau as ground, the dome of the observatory with a few lit windows, and faint stars.
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { encodeHdr } from '@lightkiln/codecs';
import { equirectToDirection } from '@lightkiln/math';

const out = process.argv[2] ?? 'out/observatory-dusk.hdr';
const width = Number(process.argv[3] ?? 2048);
const height = width / 2;

const norm = (v) => { const l = Math.hypot(...v); return v.map((x) => x / l); };
// The sun sits 2 degrees above the horizon, towards -X rotated a little to -Z (west-south-west).
const sunElev = (2 * Math.PI) / 180;
const sunAz = (-70 * Math.PI) / 180; // from -Z towards -X
const sun = norm([Math.sin(sunAz) * Math.cos(sunElev), Math.sin(sunElev), -Math.cos(sunAz) * Math.cos(sunElev)]);
const sunCos = Math.cos((0.35 * Math.PI) / 180); // apparent radius 0.35 degrees
const sunRadiance = [60000, 42000, 26000];

// Lit windows of the dome: small rectangles in azimuth/elevation (degrees), warm light.
const windows = [[38, -1.5], [41, -1.2], [44, -1.6], [150, -0.8], [152, -0.9]];

function hash(i, j) {
  let h = (Math.imul(i, 374761393) + Math.imul(j, 668265263)) >>> 0;
  h = Math.imul(h ^ (h >>> 13), 1274126177) >>> 0;
  return (h ^ (h >>> 16)) / 4294967296;
}

function radiance(x, y, z, i, j) {
  const cosSun = x * sun[0] + y * sun[1] + z * sun[2];
  if (cosSun > sunCos) return sunRadiance;
  const elev = Math.asin(Math.max(-1, Math.min(1, y)));
  const az = (Math.atan2(x, -z) * 180) / Math.PI; // 0 at -Z, +90 at +X
  if (y >= 0) {
    // Dusk gradient: deep blue zenith, orange band at the horizon, brighter towards the sun.
    const t = Math.pow(1 - y, 6);
    const glow = Math.pow(Math.max(0, cosSun), 12) * 6 + Math.pow(Math.max(0, cosSun), 3) * 0.6;
    const r = 0.05 + 1.4 * t + glow * 1.6;
    const g = 0.08 + 0.7 * t + glow * 0.9;
    const b = 0.25 + 0.25 * t + glow * 0.35;
    const star = y > 0.35 && hash(i, j) > 0.9995 ? 2 : 0;
    return [r + star, g + star, b + star];
  }
  // Observatory dome silhouette with lit windows just below the horizon line.
  for (const [waz, wel] of windows) {
    if (Math.abs(az - waz) < 0.5 && Math.abs((elev * 180) / Math.PI - wel) < 0.3) return [180, 110, 45];
  }
  // Warm plateau, lit by the low sun: brighter towards the sun side, darkening below.
  const facing = 0.5 + 0.5 * (x * sun[0] + z * sun[2]);
  const k = 0.12 + 0.25 * facing * Math.exp(elev * 3);
  return [0.55 * k + 0.02, 0.36 * k + 0.015, 0.22 * k + 0.01];
}

const data = new Float32Array(width * height * 3);
const d = new Float64Array(3);
const S = 3; // supersamples per axis per pixel (area-averaged pixels)
for (let j = 0; j < height; j++) {
  for (let i = 0; i < width; i++) {
    let r = 0; let g = 0; let b = 0; let w = 0;
    for (let sy = 0; sy < S; sy++) {
      for (let sx = 0; sx < S; sx++) {
        const v = (j + (sy + 0.5) / S) / height;
        equirectToDirection(d, 0, (i + (sx + 0.5) / S) / width, v);
        const c = radiance(d[0], d[1], d[2], i, j);
        const weight = Math.sin(v * Math.PI);
        r += c[0] * weight; g += c[1] * weight; b += c[2] * weight; w += weight;
      }
    }
    const o = (j * width + i) * 3;
    data[o] = r / w; data[o + 1] = g / w; data[o + 2] = b / w;
  }
}
mkdirSync(dirname(out), { recursive: true });
writeFileSync(out, encodeHdr({ width, height, channels: 3, data }, { variables: { SOFTWARE: 'lightkiln example observatory-dusk' } }));
console.error(`wrote ${out} (${width} x ${height})`);
