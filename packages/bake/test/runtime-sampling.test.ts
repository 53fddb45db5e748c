/**
 * What the shader sees: the default specular chain sampled the way a GPU samples it (textureLod with
 * trilinear filtering and seamless cube edges, test/helpers/runtime-sampling.ts), at directions spread
 * over the sphere and roughness 0.1 ... 1 in steps of 0.05, at the level of detail the manifest's
 * `roughnessToLod` formula gives, against the exact prefiltered radiance LD(d, r) of an analytic sky
 * (test/helpers/sunny-sky.ts; shares no code with the bake). Target: relative RMSE (over the mean) within
 * 1.5% for every r on a smooth sky; p99, directions within a texel of a face edge of an 8 x 8 level, and
 * the neighbourhood of a sun are reported beside it.
 */

import { afterAll, describe, expect, it } from 'vitest';
import { decodeKtx2, encodePfm } from '@lightkiln/codecs';
import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { exactPrefiltered, makeSunnySky, renderEquirect, type SunnySky } from '../../../test/helpers/sunny-sky.js';
import { sampleChain, type ChainLevel } from '../../../test/helpers/runtime-sampling.js';

const baker = createBaker({ threads: 2, cache: false });
afterAll(async () => {
  await baker.close();
  await closeSharedPools();
});

/** The manifest's mapping, parsed: "lod = (L - 1) * pow(r, E), L = N". */
function parseLod(formula: string): (r: number) => number {
  const m = /^lod = \(L - 1\) \* pow\(r, ([0-9.]+)\), L = (\d+)$/.exec(formula);
  if (m === null) throw new Error(`unexpected roughnessToLod "${formula}"`);
  const e = Number(m[1]);
  const L = Number(m[2]);
  return (r) => (L - 1) * r ** e;
}

function directions(count: number): number[][] {
  let seed = 987654321;
  const rnd = (): number => {
    seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
    return seed / 4294967296;
  };
  return Array.from({ length: count }, () => {
    const z = 2 * rnd() - 1;
    const p = 2 * Math.PI * rnd();
    const s = Math.sqrt(1 - z * z);
    return [s * Math.cos(p), s * Math.sin(p), z];
  });
}

/** Near a face edge: the second-largest |component| within 1/8 of the largest (one texel of an 8 x 8 face). */
const nearEdge = (d: number[]): boolean => {
  const a = d.map(Math.abs).sort((x, y) => y - x);
  return a[0]! - a[1]! < a[0]! / 8;
};

async function bakeChain(env: SunnySky, size: number, width: number): Promise<{ chain: ChainLevel[]; lod: (r: number) => number }> {
  const bytes = encodePfm({ width, height: width / 2, channels: 3, data: renderEquirect(env, width, width / 2) });
  const result = await baker.bake({ input: { bytes, name: 'sky.pfm' }, size, output: { specularFormat: 'rgba32f' }, dfg: { enabled: false } });
  const file = decodeKtx2(result.artifacts[0]!.bytes);
  return { chain: file.levels.map((l, m) => ({ size: size >> m, channels: 4, data: l.data })), lod: parseLod(result.manifest.roughnessToLod) };
}

interface Figures { rmse: number; p99: number; edgeRmse: number }

function measure(env: SunnySky, chain: ChainLevel[], lod: (r: number) => number, dirs: number[][], r: number): Figures {
  const out = new Float64Array(3);
  const e = new Float64Array(3);
  let se = 0; let sy = 0; let seEdge = 0; let syEdge = 0; let nEdge = 0;
  const rel: number[] = [];
  for (const d of dirs) {
    exactPrefiltered(env, d[0]!, d[1]!, d[2]!, r, e);
    sampleChain(out, chain, d[0]!, d[1]!, d[2]!, lod(r));
    const ye = 0.2126 * e[0]! + 0.7152 * e[1]! + 0.0722 * e[2]!;
    const yt = 0.2126 * out[0]! + 0.7152 * out[1]! + 0.0722 * out[2]!;
    se += (yt - ye) ** 2; sy += ye;
    rel.push(Math.abs(yt - ye) / ye);
    if (nearEdge(d)) { seEdge += (yt - ye) ** 2; syEdge += ye; nEdge++; }
  }
  rel.sort((a, b) => a - b);
  return { rmse: Math.sqrt(se / dirs.length) / (sy / dirs.length), p99: rel[Math.floor(0.99 * rel.length)]!, edgeRmse: nEdge > 0 ? Math.sqrt(seEdge / nEdge) / (syEdge / nEdge) : 0 };
}

const ROUGHNESS = Array.from({ length: 19 }, (_, i) => Math.round((0.1 + 0.05 * i) * 100) / 100);

describe('runtime sampling of the default chain (textureLod, trilinear, seamless)', () => {
  for (const size of [128, 256, 512]) {
    it(`stays within 1.5% RMSE for every r in [0.1, 1] on a smooth sky (size ${size})`, async () => {
      const env = makeSunnySky(null);
      const { chain, lod } = await bakeChain(env, size, 1024);
      const dirs = directions(700);
      const lines: string[] = [];
      let worst = 0;
      for (const r of ROUGHNESS) {
        const f = measure(env, chain, lod, dirs, r);
        lines.push(`r ${r}: ${(f.rmse * 100).toFixed(2)}% (p99 ${(f.p99 * 100).toFixed(2)}%, edges ${(f.edgeRmse * 100).toFixed(2)}%)`);
        worst = Math.max(worst, f.rmse);
      }
      console.log(`size ${size}, ${chain.length} levels:\n  ${lines.join('\n  ')}`);
      expect(worst).toBeLessThan(0.015);
    }, 300_000);
  }

  it('reports the neighbourhood of a sun (within 20 degrees; no target: the blend of two levels cannot hold a sun lobe between them)', async () => {
    const sun = [0.42, 0.35, -0.7];
    const l = Math.hypot(...sun);
    const dir = sun.map((v) => v / l) as [number, number, number];
    const env = makeSunnySky({ direction: dir, diameterDeg: 0.5, ratio: 1e4 });
    const { chain, lod } = await bakeChain(env, 128, 2048);
    const near = directions(4000).filter((d) => d[0]! * dir[0] + d[1]! * dir[1] + d[2]! * dir[2] > Math.cos((20 * Math.PI) / 180)).slice(0, 150);
    const lines = [0.2, 0.4, 0.6, 0.8, 1].map((r) => {
      const f = measure(env, chain, lod, near, r);
      return `r ${r}: ${(f.rmse * 100).toFixed(2)}% (p99 ${(f.p99 * 100).toFixed(2)}%)`;
    });
    console.log(`near a 0.5-degree 1e4 x sun, size 128, ${near.length} directions: ${lines.join(', ')}`);
    expect(near.length).toBeGreaterThan(50);
  }, 300_000);
});
