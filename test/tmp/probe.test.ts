import { afterAll, it } from 'vitest';
import { decodeKtx2, encodePfm } from '@lightkiln/codecs';
import { cubeTexelCenterDirection } from '@lightkiln/math';
import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { exactPrefiltered, makeSunnySky, renderEquirect } from '../helpers/sunny-sky.js';
const baker = createBaker({ threads: 2, cache: false });
afterAll(async () => { await baker.close(); await closeSharedPools(); });
const norm = (v: number[]) => { const l = Math.hypot(...v); return v.map((x) => x / l) as [number, number, number]; };
const cases = (process.env.CASES ?? '1,1,1:1:1e5:64:2048').split(';').map((s) => { const [d, deg, ratio, size, width] = s.split(':'); return { dir: norm(d!.split(',').map(Number)), deg: +deg!, ratio: +ratio!, size: +size!, width: +width! }; });
it('probe', async () => {
  for (const c of cases) {
    const env = makeSunnySky({ direction: c.dir, diameterDeg: c.deg, ratio: c.ratio });
    const image = renderEquirect(env, c.width, c.width / 2);
    const bytes = encodePfm({ width: c.width, height: c.width / 2, channels: 3, data: image });
    const t0 = performance.now();
    const result = await baker.bake({ input: { bytes, name: 's.pfm' }, size: c.size, output: { specularFormat: 'rgba32f', irradianceFormat: 'rgba32f' }, dfg: { enabled: false }, ...(process.env.METHOD ? { specular: { method: process.env.METHOD } } : {}) } as any);
    const ms = performance.now() - t0;
    const spec = decodeKtx2(result.artifacts[0]!.bytes);
    const rough = result.manifest.recipe.roughness;
    const d = new Float64Array(3); const ex = new Float64Array(3);
    const line: string[] = [];
    for (let m = 1; m < spec.levels.length; m++) {
      const lv = spec.levels[m]!; const n = lv.width; const total = 6 * n * n;
      const stride = Math.max(1, Math.floor(total / 3000));
      let se = 0, sy = 0, cnt = 0; const rel: number[] = []; let worst = { e: 0, ref: 0, t: 0 };
      for (let t = 0; t < total; t += stride) {
        const face = Math.floor(t / (n * n)); const rem = t - face * n * n;
        cubeTexelCenterDirection(d, 0, face, rem % n, Math.floor(rem / n), n);
        exactPrefiltered(env, d[0]!, d[1]!, d[2]!, rough[m]!, ex);
        const yr = 0.2126 * ex[0]! + 0.7152 * ex[1]! + 0.0722 * ex[2]!;
        const yt = 0.2126 * lv.data[t * 4]! + 0.7152 * lv.data[t * 4 + 1]! + 0.0722 * lv.data[t * 4 + 2]!;
        se += (yt - yr) ** 2; sy += yr; cnt++; rel.push(Math.abs(yt - yr) / yr);
        if (Math.abs(yt - yr) > worst.e) worst = { e: Math.abs(yt - yr), ref: yr, t };
      }
      rel.sort((a, b) => a - b);
      const mean = sy / cnt;
      line.push(`L${m} r=${rough[m]!.toFixed(3)} rmse ${(100 * Math.sqrt(se / cnt) / mean).toFixed(2)}% relrms ${(100*Math.sqrt(rel.reduce((a,b)=>a+b*b,0)/cnt)).toFixed(2)}% p999 ${(100 * rel[Math.floor(0.999 * cnt)]!).toFixed(2)}% max ${(100 * rel[cnt - 1]!).toFixed(2)}% worst ${(100 * worst.e / worst.ref).toFixed(2)}% at ref/mean ${(worst.ref / mean).toFixed(1)} est ${(100*result.manifest.levels[m]!.relativeErrorEstimate).toFixed(2)}%`);
    }
    console.log(`${JSON.stringify(c)} ${ms.toFixed(0)} ms\n  ${line.join('\n  ')}`);
  }
}, 600000);
