/**
 * The equirect splat's two paths: ordinary pixels (2 x 2 sub-cells carrying the bilinear reconstruction,
 * landing code inlined in the loop) and bright pixels (cut finer, each sub-cell carrying its pixel's value,
 * split by area at texel edges, landing through Landing). Both must put the same light in the same texels:
 * on a smooth sky, where the bilinear and the pixel-square reconstructions agree to second order, every
 * texel and every luminance centroid of the two paths must agree closely; each path must keep the energy of its own
 * reconstruction up to the footprint fill (the pixel-square energy, sum of pixel x exact solid angle, is the check: common practice
 * for equirect images).
 */

import { describe, expect, it } from 'vitest';
import { sharedFloat32, toShared } from '@lightkiln/pool';
import { cubeTexelSolidAngle, directionToCubeFace } from '@lightkiln/math';
import { Landing, nodeGeometry, splatEquirect, splatSubcells, type SplatParams } from '@lightkiln/bake/kernels';
import { RETAINED_BYTES, scratchFloat64 } from '../src/kernels/scratch.js';

const W = 256;
const H = 128;
const size = 32;

function smoothSky(): Float32Array {
  const data = new Float32Array(W * H * 3);
  for (let j = 0; j < H; j++) {
    for (let i = 0; i < W; i++) {
      const o = (j * W + i) * 3;
      const u = (2 * Math.PI * (i + 0.5)) / W;
      const v = (Math.PI * (j + 0.5)) / H;
      data[o] = 1 + 0.4 * Math.sin(u) * Math.sin(v);
      data[o + 1] = 0.8 + 0.3 * Math.cos(v);
      data[o + 2] = 0.6 + 0.2 * Math.cos(2 * u) * Math.sin(v);
    }
  }
  return data;
}

function splat(src: Float32Array, brightLuminance: number, brightRefinement: number): { level0: Float32Array; centroids: Float32Array } {
  const pyramid = sharedFloat32(6 * size * size * 3);
  const centroids = sharedFloat32(6 * size * size * 3);
  const params: SplatParams = { size, srcWidth: W, srcHeight: H, subcells: splatSubcells(W, H, size), rotCos: 1, rotSin: 0, brightLuminance, brightRefinement };
  const buffers = { src: toShared(src), pyramid, centroids, geometry: nodeGeometry(size).data };
  // Half faces, as the stage tiles it.
  for (let h = 0; h < 12; h++) splatEquirect(buffers, (h * size * size) / 2, ((h + 1) * size * size) / 2, params);
  return { level0: pyramid, centroids };
}

function energy(level0: Float32Array): number {
  let e = 0;
  for (let t = 0; t < 6 * size * size; t++) {
    const r = t % (size * size);
    e += cubeTexelSolidAngle(r % size, Math.floor(r / size), size) * (0.2126 * level0[t * 3]! + 0.7152 * level0[t * 3 + 1]! + 0.0722 * level0[t * 3 + 2]!);
  }
  return e;
}

describe('equirect splat: the ordinary and the bright path agree', () => {
  it('puts the same light in the same texels on a smooth sky', () => {
    const src = smoothSky();
    const ordinary = splat(src, Infinity, 1);
    // Threshold 0: every pixel takes the bright path, at the ordinary sub-cell size (refinement 1).
    const bright = splat(src, 0, 1);
    let worst = 0;
    let worstCentroid = 0;
    for (let i = 0; i < ordinary.level0.length; i++) {
      worst = Math.max(worst, Math.abs(ordinary.level0[i]! - bright.level0[i]!) / ordinary.level0[i]!);
      worstCentroid = Math.max(worstCentroid, Math.abs(ordinary.centroids[i]! - bright.centroids[i]!));
    }
    // A texel is about 2 x 2 pixels: the ordinary path lands whole half-pixel sub-cells and fills the
    // footprint they miss, the bright path shares its sub-cells by area, so single texels differ by up to
    // about 1.3% (measured); a wrong face or texel would differ by far more.
    expect(worst).toBeLessThan(2e-2);
    // Centroid offsets are in face-frame units (a texel is 2 / 32 wide): agree to 1/20 of a texel.
    expect(worstCentroid).toBeLessThan(3e-3);
  });

  it('keeps the pixel-square energy on the bright path, at any refinement', () => {
    const src = smoothSky();
    let exact = 0;
    for (let j = 0; j < H; j++) {
      const omega = ((2 * Math.PI) / W) * (Math.cos((j * Math.PI) / H) - Math.cos(((j + 1) * Math.PI) / H));
      for (let i = 0; i < W; i++) {
        const o = (j * W + i) * 3;
        exact += omega * (0.2126 * src[o]! + 0.7152 * src[o + 1]! + 0.0722 * src[o + 2]!);
      }
    }
    // Within 5e-5: the footprint fill trades the sky's local minimum between neighbours (measured 1.5e-5).
    for (const refinement of [1, 3, 4]) {
      expect(Math.abs(energy(splat(src, 0, refinement).level0) / exact - 1)).toBeLessThan(5e-5);
    }
    // The ordinary path keeps the bilinear reconstruction's energy, within 1e-4 of the squares' here.
    expect(Math.abs(energy(splat(src, Infinity, 1).level0) / exact - 1)).toBeLessThan(1e-4);
  });

  it('keeps a sun one pixel wide where the image puts it', () => {
    const src = smoothSky();
    // A 1e4 x pixel at row 40, column 100.
    const p = (40 * W + 100) * 3;
    src[p] = 1e4; src[p + 1] = 1e4; src[p + 2] = 1e4;
    const { level0 } = splat(src, 32, 4);
    const base = splat(smoothSky(), 32, 4).level0;
    const pixelOmega = ((2 * Math.PI) / W) * (Math.cos((40 * Math.PI) / H) - Math.cos((41 * Math.PI) / H));
    const added = energy(level0) - energy(base);
    const expected = pixelOmega * (1e4 - (0.2126 * 1 + 0.7152 * 0.8 + 0.0722 * 0.6));
    // The added energy is the sun's, give or take the sky under it (the sky value of that pixel).
    expect(Math.abs(added - expected) / expected).toBeLessThan(2e-4);
  });
});

describe('the splat\'s inlined face selection', () => {
  it('lands every direction in the texel math\'s directionToCubeFace picks (Vulkan face selection, ties included)', () => {
    const n = 16;
    const out = new Float64Array(3);
    // One accumulator set per face, each tile a whole face.
    const faces = [0, 1, 2, 3, 4, 5].map((f) => {
      const count = n * n;
      const omegaSum = new Float64Array(count);
      const acc = new Landing(f, n, f * count, count, omegaSum, new Float64Array(3 * count), new Float64Array(3 * count).fill(Infinity), new Float64Array(3 * count), new Float64Array(3 * count));
      return { acc, omegaSum };
    });
    let seed = 12345;
    const rnd = (): number => {
      seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
      return seed / 4294967296;
    };
    const dirs: [number, number, number][] = [];
    for (let i = 0; i < 4000; i++) dirs.push([2 * rnd() - 1, 2 * rnd() - 1, 2 * rnd() - 1]);
    // Exact ties between major axes and face-edge directions.
    for (const d of [[1, 1, 0], [1, 0, 1], [0, 1, 1], [1, 1, 1], [-1, -1, -1], [1, -1, 1], [0.5, 0.5, -0.5], [-1, 1, 0], [0, -1, -1]] as [number, number, number][]) dirs.push(d);
    for (const [x, y, z] of dirs) {
      for (const f of faces) f.omegaSum.fill(0);
      for (const f of faces) f.acc.land(x, y, z, 1, 1, 1, 1);
      directionToCubeFace(out, 0, x, y, z);
      const face = out[0]!;
      const tx = Math.min(n - 1, Math.floor(out[1]! * n));
      const ty = Math.min(n - 1, Math.floor(out[2]! * n));
      const landed = faces.flatMap((f, i) => [...f.omegaSum].flatMap((w, t) => (w > 0 ? [[i, t]] : [])));
      expect(landed, `direction ${x}, ${y}, ${z}`).toEqual([[face, ty * n + tx]]);
    }
  });
});

describe('kernel scratch arrays (kernels/scratch.ts)', () => {
  it('reuses a slot within the retained budget and hands out fresh arrays beyond it', () => {
    const small = scratchFloat64('test small', 1000);
    expect(scratchFloat64('test small', 500).buffer).toBe(small.buffer);
    expect(scratchFloat64('test small', 500).length).toBe(500);
    // Growing past the budget: a fresh array each time, and the slot no longer pins the old one.
    const items = RETAINED_BYTES / 8 + 1;
    const a = scratchFloat64('test big', items);
    const b = scratchFloat64('test big', items);
    expect(a.length).toBe(items);
    expect(a.buffer).not.toBe(b.buffer);
    const again = scratchFloat64('test small', 1000);
    expect(again.buffer).toBe(small.buffer);
  });
});
