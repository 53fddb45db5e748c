import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { decodeKtx2, encodePfm } from '@lightkiln/codecs';
import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { equirectOf, relativeRmse } from './helpers.js';

const work = mkdtempSync(join(tmpdir(), 'lightkiln-inputs-'));
const baker = createBaker({ threads: 2, cache: false });
afterAll(async () => {
  rmSync(work, { recursive: true, force: true });
  await baker.close();
  await closeSharedPools();
});

const sky = equirectOf((x, y, z) => [1 + 0.5 * y + 0.3 * x, 0.7 + 0.2 * z, 0.5 + 0.4 * Math.max(0, y)], 256, 128);

function rgbOf(level: { data: Float32Array }): Float32Array {
  const n = level.data.length / 4;
  const out = new Float32Array(n * 3);
  for (let t = 0; t < n; t++) for (let c = 0; c < 3; c++) out[t * 3 + c] = level.data[t * 4 + c]!;
  return out;
}

describe('cube inputs (face order +X, -X, +Y, -Y, +Z, -Z and the OpenGL selection-table orientation)', () => {
  it('rebakes from our own KTX 2.0 cubemap: level 0 reproduces the source cube', async () => {
    const first = await baker.bake({ input: { bytes: sky, name: 'sky.pfm' }, size: 32, samples: 'draft', output: { specularFormat: 'rgba32f' }, dfg: { enabled: false } });
    const cubeFile = first.artifacts[0]!.bytes;
    const again = await baker.bake({ input: { bytes: cubeFile, name: 'sky.specular.ktx2' }, size: 32, samples: 'draft', output: { specularFormat: 'rgba32f' }, dfg: { enabled: false } });
    const a = decodeKtx2(cubeFile).levels[0]!;
    const b = decodeKtx2(again.artifacts[0]!.bytes).levels[0]!;
    // Resampling a cube onto a cube of the same size: the supersampled footprint average of a smooth sky.
    expect(relativeRmse(rgbOf(b), rgbOf(a))).toBeLessThan(0.005);
    expect(again.manifest.sh.radiance[0]![0]).toBeCloseTo(first.manifest.sh.radiance[0]![0], 2);
  });

  it('reads six face files +X, -X, +Y, -Y, +Z, -Z', async () => {
    const first = await baker.bake({ input: { bytes: sky, name: 'sky.pfm' }, size: 16, samples: 'draft', output: { specularFormat: 'rgba32f' }, dfg: { enabled: false } });
    const level0 = decodeKtx2(first.artifacts[0]!.bytes).levels[0]!;
    const faces = [0, 1, 2, 3, 4, 5].map((f) => {
      const data = new Float32Array(16 * 16 * 3);
      for (let t = 0; t < 256; t++) for (let c = 0; c < 3; c++) data[t * 3 + c] = level0.data[(f * 256 + t) * 4 + c]!;
      const path = join(work, `face${f}.pfm`);
      writeFileSync(path, encodePfm({ width: 16, height: 16, channels: 3, data }));
      return path;
    });
    const fromFaces = await baker.bake({ input: { faces }, name: 'faces', size: 16, samples: 'draft', output: { specularFormat: 'rgba32f' }, dfg: { enabled: false } });
    const b = decodeKtx2(fromFaces.artifacts[0]!.bytes).levels[0]!;
    expect(relativeRmse(rgbOf(b), rgbOf(level0))).toBeLessThan(0.005);
    expect(fromFaces.manifest.inputs).toHaveLength(6);
    await expect(baker.bake({ input: { faces: [...faces.slice(0, 5), join(work, 'missing.pfm')] } })).rejects.toThrow(/missing.pfm/);
  });
});

describe('SH ringing window', () => {
  it('applies the Hann window to the manifest coefficients (Sloan 2008)', async () => {
    const plain = await baker.bake({ input: { bytes: sky, name: 'sky.pfm' }, size: 16, samples: 'draft', dfg: { enabled: false } });
    const hann = await baker.bake({ input: { bytes: sky, name: 'sky.pfm' }, size: 16, samples: 'draft', irradiance: { shWindow: 'hann', shWindowWidth: 3 }, dfg: { enabled: false } });
    expect(hann.manifest.sh.radiance[0]![0]).toBeCloseTo(plain.manifest.sh.radiance[0]![0], 10);
    // Band 1 scaled by (1 + cos(pi / 3)) / 2 = 0.75, band 2 by 0.25.
    expect(hann.manifest.sh.radiance[3]![0]).toBeCloseTo(0.75 * plain.manifest.sh.radiance[3]![0], 10);
    expect(hann.manifest.sh.radiance[6]![2]).toBeCloseTo(0.25 * plain.manifest.sh.radiance[6]![2], 10);
    expect(hann.manifest.sh.window).toEqual({ kind: 'hann', width: 3 });
  });
});
