import { afterAll, describe, expect, it } from 'vitest';
import { decodeKtx2 } from '@lightkiln/codecs';
import { cubeTexelCenterDirection, evalSh9Basis } from '@lightkiln/math';
import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { equirectOf, relativeRmse, type Radiance } from './helpers.js';
import { integrateSphere } from '../../../test/helpers/quadrature.js';

const baker = createBaker({ threads: 2, cache: false });
afterAll(async () => {
  await baker.close();
  await closeSharedPools();
});

function rgb(level: { data: Float32Array }, channels: number): Float32Array {
  const n = level.data.length / channels;
  const out = new Float32Array(n * 3);
  for (let t = 0; t < n; t++) for (let c = 0; c < 3; c++) out[t * 3 + c] = level.data[t * channels + c]!;
  return out;
}

// A sky of our own: a vertical gradient, a warm side and a soft bright spot (exp lobe, peak 20).
const spot = [0.3, 0.5, -0.81].map((v, _, a) => v / Math.hypot(...a));
const sky: Radiance = (x, y, z) => {
  const c = x * spot[0]! + y * spot[1]! + z * spot[2]!;
  const s = Math.exp((c - 1) * 40) * 20;
  return [1 + 0.5 * y + s, 0.8 + 0.3 * x + s, 0.6 + s];
};

describe('constant environment (exact: every level L, E = pi L)', () => {
  it('keeps every specular level and the irradiance at float precision', async () => {
    const bytes = equirectOf(() => [0.75, 1.5, 3], 64, 32);
    const result = await baker.bake({ input: { bytes, name: 'grey.pfm' }, size: 16, levels: 5, samples: 'draft', output: { specularFormat: 'rgba32f', irradianceFormat: 'rgba32f' }, dfg: { enabled: false } });
    const spec = decodeKtx2(result.artifacts[0]!.bytes);
    expect(spec.levels.length).toBe(5);
    for (const level of spec.levels) {
      for (let t = 0; t < level.data.length / 4; t++) {
        expect(level.data[t * 4]).toBeCloseTo(0.75, 5);
        expect(level.data[t * 4 + 1]).toBeCloseTo(1.5, 5);
        expect(level.data[t * 4 + 2]).toBeCloseTo(3, 5);
      }
    }
    const irr = decodeKtx2(result.artifacts[1]!.bytes).levels[0]!.data;
    for (let t = 0; t < irr.length / 4; t++) {
      expect(irr[t * 4]! / (Math.PI * 0.75)).toBeCloseTo(1, 4);
      expect(irr[t * 4 + 2]! / (Math.PI * 3)).toBeCloseTo(1, 4);
    }
    // SH9: L00 = L * 4 pi * Y00 = L * 2 sqrt(pi), higher bands 0; irradiance coefficient A0 L00.
    const sh = result.manifest.sh;
    expect(sh.radiance[0]![1]).toBeCloseTo(1.5 * 2 * Math.sqrt(Math.PI), 4);
    for (let k = 1; k < 9; k++) expect(Math.abs(sh.radiance[k]![1])).toBeLessThan(1e-5);
    expect(sh.irradiance[0]![1]).toBeCloseTo(Math.PI * 1.5 * 2 * Math.sqrt(Math.PI), 4);
  });
});

describe('specular levels against the reference convolution (target: 1% relative RMSE at the default preset)', () => {
  it('stays within 1% on every level of the analytic sky', async () => {
    const bytes = equirectOf(sky, 512, 256);
    const base = { input: { bytes, name: 'sky.pfm' }, size: 64, output: { specularFormat: 'rgba32f' as const }, dfg: { enabled: false } };
    const sampled = decodeKtx2((await baker.bake(base)).artifacts[0]!.bytes);
    const reference = decodeKtx2((await baker.bake({ ...base, quality: 'reference' })).artifacts[0]!.bytes);
    const errors = sampled.levels.map((level, m) => relativeRmse(rgb(level, 4), rgb(reference.levels[m]!, 4)));
    console.log(`relative RMSE per level (%): ${errors.map((e) => (e * 100).toFixed(2)).join(' ')}`);
    expect(errors[0]).toBe(0);
    for (const e of errors) expect(e).toBeLessThan(0.01);
  });

  it('puts a +X feature on the +X face and turns +Z towards +X for a positive rotation (right-handed about +Y)', async () => {
    const lobe = (ax: number, ay: number, az: number): Radiance => (x, y, z) => {
      const v = Math.exp((ax * x + ay * y + az * z - 1) * 20) * 10 + 0.1;
      return [v, v, v];
    };
    const faceMean = (bytes: Uint8Array, face: number): number => {
      const level = decodeKtx2(bytes).levels[0]!;
      const n = level.width * level.width;
      let s = 0;
      for (let t = face * n; t < (face + 1) * n; t++) s += level.data[t * 4]!;
      return s / n;
    };
    const opts = { size: 16, samples: 'draft' as const, dfg: { enabled: false } };
    const atX = (await baker.bake({ input: { bytes: equirectOf(lobe(1, 0, 0), 128, 64), name: 'x.pfm' }, ...opts })).artifacts[0]!.bytes;
    const means = [0, 1, 2, 3, 4, 5].map((f) => faceMean(atX, f));
    expect(means.indexOf(Math.max(...means))).toBe(0);
    // Source feature at +Z, rotated by +90 degrees: the baked cube shows it at +X (R(90) z = x).
    const rotated = (await baker.bake({ input: { bytes: equirectOf(lobe(0, 0, 1), 128, 64), name: 'z.pfm' }, rotationDeg: 90, ...opts })).artifacts[0]!.bytes;
    const rmeans = [0, 1, 2, 3, 4, 5].map((f) => faceMean(rotated, f));
    expect(rmeans.indexOf(Math.max(...rmeans))).toBe(0);
    // And +Y stays on +Y (row 0 of the equirect is the top).
    const up = (await baker.bake({ input: { bytes: equirectOf(lobe(0, 1, 0), 128, 64), name: 'y.pfm' }, ...opts })).artifacts[0]!.bytes;
    const umeans = [0, 1, 2, 3, 4, 5].map((f) => faceMean(up, f));
    expect(umeans.indexOf(Math.max(...umeans))).toBe(2);
  });
});

describe('irradiance (Ramamoorthi & Hanrahan 2001 checks)', () => {
  // L = 1 + 0.6 x - 0.3 y + 0.2 z + 0.4 xy: exactly representable in SH9, so E is known in closed form:
  // E(n) = pi + (2 pi / 3) a.n + (pi / 4) 0.4 n_x n_y (band weights A_l times the coefficients).
  const f: Radiance = (x, y, z) => {
    const v = 1 + 0.6 * x - 0.3 * y + 0.2 * z + 0.4 * x * y;
    return [v, v, v];
  };
  const exactE = (x: number, y: number, z: number): number => Math.PI + ((2 * Math.PI) / 3) * (0.6 * x - 0.3 * y + 0.2 * z) + (Math.PI / 4) * 0.4 * x * y;

  it('projects SH9 within 0.5% of the exact projection', async () => {
    const result = await baker.bake({ input: { bytes: equirectOf(f, 256, 128), name: 'lin.pfm' }, size: 64, samples: 'draft', dfg: { enabled: false } });
    const basis = new Float64Array(9);
    const exact = Array.from({ length: 9 }, (_, k) => integrateSphere((x, y, z) => {
      evalSh9Basis(basis, 0, x, y, z);
      return f(x, y, z)[0] * basis[k]!;
    }, 48, 48));
    const l00 = exact[0]!;
    result.manifest.sh.radiance.forEach((triple, k) => {
      expect(Math.abs(triple[0] - exact[k]!) / l00, `coefficient ${k}`).toBeLessThan(0.005);
    });
  });

  for (const cubeSource of ['convolution', 'sh9'] as const) {
    it(`irradiance cube (${cubeSource}) within 1% of the exact E(n)`, async () => {
      const result = await baker.bake({ input: { bytes: equirectOf(f, 256, 128), name: 'lin.pfm' }, size: 64, samples: 'draft', irradiance: { cubeSize: 8, cubeSource }, output: { irradianceFormat: 'rgba32f' }, dfg: { enabled: false } });
      const cube = decodeKtx2(result.artifacts[1]!.bytes).levels[0]!.data;
      const d = new Float64Array(3);
      let worst = 0;
      for (let face = 0; face < 6; face++) {
        for (let y = 0; y < 8; y++) {
          for (let x = 0; x < 8; x++) {
            cubeTexelCenterDirection(d, 0, face, x, y, 8);
            const e = exactE(d[0]!, d[1]!, d[2]!);
            worst = Math.max(worst, Math.abs(cube[((face * 8 + y) * 8 + x) * 4]! - e) / e);
          }
        }
      }
      expect(worst).toBeLessThan(0.01);
    });
  }
});
