/**
 * The two specular estimators side by side on the same sunny input (the synthetic sky of common.ts plus a
 * 0.5-degree sun 1e4 x brighter), the whole chain of a 128 bake on one thread: the default hierarchical
 * quadrature against filtered importance sampling at the default preset, and each one's worst-level
 * 99.9th-percentile error against the exhaustive reference of the same pyramid (the sweep's measure).
 * Then the cost figures of the default against filtered sampling on the demo scene (examples/
 * observatory-dusk, 2048 x 1024) at 256 on 2 threads, whole bakes (every artifact) in one process after a
 * warm-up bake each, interleaved: the specular stage and the whole bake, medians of 3.
 */

import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { WorkerPool } from '@lightkiln/pool';
import { createBaker } from '@lightkiln/bake';
import { buildPyramid, prefilterLevels, type LevelRequest, type LevelResult } from '@lightkiln/bake/kernels';
import { record, runBench, syntheticSky } from './common.js';

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;

/** The demo sky as the example script writes it, read back as bytes. */
function demoSky(width: number): Uint8Array {
  const dir = mkdtempSync(join(tmpdir(), 'lightkiln-demo-'));
  try {
    const out = join(dir, 'observatory-dusk.hdr');
    const script = fileURLToPath(new URL('../../examples/observatory-dusk/make-sky.mjs', import.meta.url));
    const r = spawnSync(process.execPath, [script, out, String(width)], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`make-sky failed: ${r.stderr}`);
    return new Uint8Array(readFileSync(out));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Default (quadrature) against filtered sampling at the default preset: whole bakes of the demo at 256, 2 threads. */
async function demoCost(): Promise<void> {
  const bytes = demoSky(2048);
  const baker = createBaker({ threads: 2, cache: false });
  const runs = { quadrature: { specular: [] as number[], whole: [] as number[] }, sampled: { specular: [] as number[], whole: [] as number[] } };
  try {
    for (let i = 0; i < 4; i++) {
      for (const quality of ['quadrature', 'sampled'] as const) {
        const t = performance.now();
        const result = await baker.bake({ input: { bytes, name: 'observatory-dusk.hdr' }, size: 256, quality });
        const whole = performance.now() - t;
        if (i === 0) continue;
        runs[quality].specular.push(result.manifest.timingsMs.specular!);
        runs[quality].whole.push(whole);
      }
    }
  } finally {
    await baker.close();
  }
  const q = runs.quadrature;
  const f = runs.sampled;
  record('demo 256, 2 threads: specular stage, default / filtered', median(q.specular) / median(f.specular), 'x', `medians of 3: ${median(q.specular).toFixed(0)} ms vs ${median(f.specular).toFixed(0)} ms, target <= 0.5`);
  record('demo 256, 2 threads: whole bake, default / filtered', median(q.whole) / median(f.whole), 'x', `medians of 3: ${median(q.whole).toFixed(0)} ms vs ${median(f.whole).toFixed(0)} ms, target <= 0.8`);
}

function sunnySky(width: number, height: number): Float32Array {
  const data = syntheticSky(width, height);
  // A disc of 0.5 degrees around (0.42, 0.35, -0.7), equirect u = 0.5 + atan2(x, -z) / 2 pi, v = acos(y) / pi.
  const s = [0.42, 0.35, -0.7].map((v, _, a) => v / Math.hypot(...a));
  const cosR = Math.cos((0.25 * Math.PI) / 180);
  for (let j = 0; j < height; j++) {
    const theta = ((j + 0.5) / height) * Math.PI;
    for (let i = 0; i < width; i++) {
      const phi = ((i + 0.5) / width - 0.5) * 2 * Math.PI;
      const x = Math.sin(theta) * Math.sin(phi);
      const y = Math.cos(theta);
      const z = -Math.sin(theta) * Math.cos(phi);
      if (x * s[0]! + y * s[1]! + z * s[2]! > cosR) for (let c = 0; c < 3; c++) data[(j * width + i) * 3 + c] = 1e4;
    }
  }
  return data;
}

function worstP999(test: readonly LevelResult[], ref: readonly LevelResult[]): number {
  let worst = 0;
  test.forEach((level, m) => {
    const r = ref[m]!.data;
    const rel: number[] = [];
    for (let t = 0; t < r.length / 3; t++) {
      const yr = 0.2126 * r[t * 3]! + 0.7152 * r[t * 3 + 1]! + 0.0722 * r[t * 3 + 2]!;
      const yt = 0.2126 * level.data[t * 3]! + 0.7152 * level.data[t * 3 + 1]! + 0.0722 * level.data[t * 3 + 2]!;
      rel.push(Math.abs(yt - yr) / yr);
    }
    rel.sort((a, b) => a - b);
    worst = Math.max(worst, rel[Math.min(rel.length - 1, Math.floor(0.999 * rel.length))]!);
  });
  return worst;
}

export async function estimatorsBench(): Promise<void> {
  const inline = new WorkerPool({ threads: 0 });
  const ctx = { pool: inline, signal: undefined, onProgress: undefined, targetTileCost: undefined };
  const W = 2048;
  const source = { kind: 'equirect' as const, width: W, height: W / 2, data: sunnySky(W, W / 2), sanitized: { nan: 0, infinite: 0, negative: 0, clampedHigh: 0 } };
  const size = 128;
  const pyramid = await buildPyramid(source, size, 0, ctx);
  const levels = Math.log2(size) + 1;
  const requests: LevelRequest[] = Array.from({ length: levels - 1 }, (_, i) => {
    const r = (i + 1) / (levels - 1);
    return { level: i + 1, faceSize: size >> (i + 1), perceptualRoughness: r, requestedSamples: Math.max(8, Math.round((256 + 768 * r) / 8) * 8) };
  });
  const common = { filtered: true, lodBias: 0.5, clampLuminance: 0, rotateSequence: false };
  let quadrature: LevelResult[] = [];
  let filtered: LevelResult[] = [];
  const results = await runBench(`specular chain of a ${size} bake, one thread, 2048 x 1024 sunny sky`, {
    quadrature: async () => { quadrature = await prefilterLevels(pyramid, requests, { ...common, quality: 'quadrature' }, ctx); },
    'filtered default preset': async () => { filtered = await prefilterLevels(pyramid, requests, { ...common, quality: 'sampled' }, ctx); },
  }, { iterations: 3 });
  const reference = await prefilterLevels(pyramid, requests.slice(0, 3), { ...common, quality: 'reference' }, ctx);
  record('quadrature specular chain', results.quadrature!.medianMs, 'ms', `${quadrature.map((l) => l.usedSamples).join('/')} nodes per texel by level`);
  record('filtered specular chain', results['filtered default preset']!.medianMs, 'ms', 'default preset, 256..1024 samples');
  record('quadrature worst p99.9 (levels 1-3, vs exhaustive)', worstP999(quadrature.slice(0, 3), reference) * 100, '%');
  record('filtered worst p99.9 (levels 1-3, vs exhaustive)', worstP999(filtered.slice(0, 3), reference) * 100, '%');
  await inline.close();
  await demoCost();
}
