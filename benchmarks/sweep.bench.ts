/**
 * The sample-budget targets, measured with the sweep: on the demo environment (with its very bright sun),
 * filtered against plain importance sampling at equal time; on a sun-less sky, where the default preset
 * sits against the cheapest uniform budget that keeps every level under 1% relative RMSE.
 */

import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { closeSharedPools, sweepBudgets, sweepReport, type SweepResult } from '@lightkiln/bake';
import { encodePfm } from '@lightkiln/codecs';
import { equirectToDirection } from '@lightkiln/math';
import { record } from './common.js';

function softSky(width: number, height: number): Uint8Array {
  const data = new Float32Array(width * height * 3);
  const d = new Float64Array(3);
  const spot = [0.3, 0.5, -0.81].map((v, _, a) => v / Math.hypot(...a));
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      equirectToDirection(d, 0, (i + 0.5) / width, (j + 0.5) / height);
      const s = Math.exp((d[0]! * spot[0]! + d[1]! * spot[1]! + d[2]! * spot[2]! - 1) * 40) * 20;
      const o = (j * width + i) * 3;
      data[o] = 1 + 0.5 * d[1]! + s; data[o + 1] = 0.8 + 0.3 * d[0]! + s; data[o + 2] = 0.6 + s;
    }
  }
  return encodePfm({ width, height, channels: 3, data });
}

function perLevelRatio(result: SweepResult): number[] {
  const at = (m: string): readonly number[] => result.points.find((p) => p.method === m && p.budget === 'default')!.p999;
  const f = at('filtered');
  const p = at('plain');
  return f.slice(1).map((v, i) => v / p[i + 1]!);
}

export async function sweepBench(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'lightkiln-sweep-'));
  try {
    const demo = join(dir, 'observatory-dusk.hdr');
    const script = fileURLToPath(new URL('../../examples/observatory-dusk/make-sky.mjs', import.meta.url));
    const gen = spawnSync(process.execPath, [script, demo, '1024'], { encoding: 'utf8' });
    if (gen.status !== 0) throw new Error(gen.stderr);
    const budgets = [64, 128, 256, 512, 1024, 2048, 'default'] as const;
    const dusk = await sweepBudgets({ recipe: { input: { bytes: readFileSync(demo), name: 'observatory-dusk.hdr' }, size: 64 }, budgets: [...budgets], repeats: 3 });
    console.log(sweepReport(dusk).markdown);
    record('demo: filtered / plain worst-level p99.9 at the plain default-preset time', dusk.summary.filteredOverPlainP999AtDefaultTime ?? NaN, '', 'target <= 0.25');
    const ratios = perLevelRatio(dusk);
    record('demo: worst per-level filtered / plain p99.9, both at the default preset', Math.max(...ratios), '', `levels 1..${ratios.length}: ${ratios.map((r) => r.toFixed(3)).join(' ')}`);
    const soft = await sweepBudgets({ recipe: { input: { bytes: softSky(512, 256), name: 'soft-sky.pfm' }, size: 64 }, budgets: [...budgets], methods: ['filtered', 'plain'], repeats: 3 });
    console.log(sweepReport(soft).markdown);
    const c = soft.summary.cheapestUnderOnePercent;
    record('soft sky: cheapest filtered budget under 1% on every level', c === null ? NaN : c.medianMs, 'ms', c === null ? 'none' : `budget ${c.budget}`);
    record('soft sky: default preset time / cheapest', soft.summary.defaultOverCheapest ?? NaN, 'x', 'target within 1.2');
  } finally {
    rmSync(dir, { recursive: true, force: true });
    await closeSharedPools();
  }
}
