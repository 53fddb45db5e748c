import { afterAll, it } from 'vitest';
import { decodeKtx2, encodePfm } from '@lightkiln/codecs';
import { cubeTexelCenterDirection, cubeTexelSolidAngle } from '@lightkiln/math';
import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { makeSunnySky, renderEquirect } from '../helpers/sunny-sky.js';
const baker = createBaker({ threads: 2, cache: false });
afterAll(async () => { await baker.close(); await closeSharedPools(); });
const norm = (v: number[]) => { const l = Math.hypot(...v); return v.map((x) => x / l) as [number, number, number]; };
const cases = (process.env.CASES ?? '1,1,1:1:1e5:64:1024').split(';').map((s) => { const [d, deg, ratio, size, width] = s.split(':'); return { dir: norm(d!.split(',').map(Number)), deg: +deg!, ratio: +ratio!, size: +size!, width: +width! }; });
function lobe(c: number, a2: number) { if (c <= 0) return 0; const q = 1 + a2 + c * (a2 - 1); return c / (q * q); }
it('probe vs source convolution', async () => {
  for (const c of cases) {
    const env = makeSunnySky({ direction: c.dir, diameterDeg: c.deg, ratio: c.ratio });
    const W = c.width, H = W / 2;
    const image = renderEquirect(env, W, H);
    const bytes = encodePfm({ width: W, height: H, channels: 3, data: image });
    const result = await baker.bake({ input: { bytes, name: 's.pfm' }, size: c.size, output: { specularFormat: 'rgba32f', irradianceFormat: 'rgba32f' }, dfg: { enabled: false }, ...(process.env.QUALITY ? { quality: process.env.QUALITY } : {}) } as any);
    const spec = decodeKtx2(result.artifacts[0]!.bytes);
    const rough = result.manifest.recipe.roughness;
    // pixel directions + luminance + solid angle
    const S = 4;
    const N = W * H;
    const Y = new Float64Array(N);
    for (let p = 0; p < N; p++) Y[p] = 0.2126 * image[p * 3]! + 0.7152 * image[p * 3 + 1]! + 0.0722 * image[p * 3 + 2]!;
    const dx = new Float64Array(N * S * S), dy = new Float64Array(N * S * S), dz = new Float64Array(N * S * S), om = new Float64Array(N * S * S);
    for (let j = 0; j < H; j++) for (let i = 0; i < W; i++) for (let sy = 0; sy < S; sy++) for (let sx = 0; sx < S; sx++) {
      const u = (i + (sx + 0.5) / S) / W, v = (j + (sy + 0.5) / S) / H;
      const phi = (u - 0.5) * 2 * Math.PI, th = v * Math.PI;
      const q = ((j * W + i) * S + sy) * S + sx;
      dx[q] = Math.sin(th) * Math.sin(phi); dy[q] = Math.cos(th); dz[q] = -Math.sin(th) * Math.cos(phi);
      om[q] = Math.sin(th) * (2 * Math.PI / (W * S)) * (Math.PI / (H * S));
    }
    { const l0 = spec.levels[0]!; const size = c.size; let e0 = 0; let es = 0;
      for (let t = 0; t < 6 * size * size; t++) { const rem = t % (size * size); e0 += cubeTexelSolidAngle(rem % size, Math.floor(rem / size), size) * (0.2126 * l0.data[t * 4]! + 0.7152 * l0.data[t * 4 + 1]! + 0.0722 * l0.data[t * 4 + 2]!); }
      for (let q = 0; q < om.length; q++) es += om[q]! * Y[(q / (S * S)) | 0]!;
      console.log('energy', e0 / es - 1); }
    const d = new Float64Array(3);
    const line: string[] = [];
    for (let m = 1; m < spec.levels.length; m++) {
      const lv = spec.levels[m]!; const n = lv.width; const total = 6 * n * n;
      const stride = Math.max(1, Math.floor(total / 400));
      const a2 = rough[m]! ** 4;
      let se = 0, sy = 0, cnt = 0, mx = 0; let worst = 0, wref = 0;
      const picks: number[] = [];
      for (let t = 0; t < total; t += stride) picks.push(t);
      // plus the texels nearest the sun
      let best = -2, bt = 0;
      for (let t = 0; t < total; t++) { const face = Math.floor(t / (n * n)); const rem = t - face * n * n; cubeTexelCenterDirection(d, 0, face, rem % n, Math.floor(rem / n), n); const cc = d[0]! * c.dir[0] + d[1]! * c.dir[1] + d[2]! * c.dir[2]; if (cc > best) { best = cc; bt = t; } }
      picks.push(bt);
      for (const t of picks) {
        const face = Math.floor(t / (n * n)); const rem = t - face * n * n;
        cubeTexelCenterDirection(d, 0, face, rem % n, Math.floor(rem / n), n);
        const nx = d[0]!, ny = d[1]!, nz = d[2]!;
        let num = 0, den = 0;
        for (let q = 0; q < dx.length; q++) { const w = lobe(nx * dx[q]! + ny * dy[q]! + nz * dz[q]!, a2) * om[q]!; num += w * Y[(q / (S * S)) | 0]!; den += w; }
        const yr = num / den;
        const yt = 0.2126 * lv.data[t * 4]! + 0.7152 * lv.data[t * 4 + 1]! + 0.0722 * lv.data[t * 4 + 2]!;
        se += (yt - yr) ** 2; sy += yr; cnt++; const e = Math.abs(yt - yr) / yr; if (e > mx) mx = e;
        if (t === bt) { worst = e; wref = yr; }
      }
      line.push(`L${m} r=${rough[m]!.toFixed(3)} rmse/mean ${(100 * Math.sqrt(se / cnt) / (sy / cnt)).toFixed(3)}% max ${(100 * mx).toFixed(3)}% peak ${(100 * worst).toFixed(3)}% (peak/mean ${(wref / (sy / cnt)).toFixed(0)})`);
    }
    console.log(`${JSON.stringify(c)}\n  ${line.join('\n  ')}`);
  }
}, 900000);
