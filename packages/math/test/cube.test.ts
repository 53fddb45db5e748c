import { describe, expect, it } from 'vitest';
import {
  cubeFaceSolidAngleTable, cubeFaceToDirection, cubeTexelCenterDirection, cubeTexelSolidAngle, directionToCubeFace,
  directionToEquirect, equirectPixelSolidAngle, equirectToDirection,
} from '@lightkiln/math';
import { integrate2d } from '../../../test/helpers/quadrature.js';

const FOUR_PI = 4 * Math.PI;

describe('cube face selection (Vulkan spec, Cube Map Face Selection; OpenGL 4.6 core sec. 8.13)', () => {
  it('selects the examples of the Vulkan selection table', () => {
    const out = new Float64Array(3);
    directionToCubeFace(out, 0, 1, 0.5, -0.25);
    expect(out[0]).toBe(0); expect(out[1]).toBeCloseTo(0.625, 12); expect(out[2]).toBeCloseTo(0.25, 12);
    directionToCubeFace(out, 0, 0.2, -0.9, 0.3);
    expect(out[0]).toBe(3); expect(out[1]).toBeCloseTo(0.611111, 6); expect(out[2]).toBeCloseTo(0.333333, 6);
    directionToCubeFace(out, 0, -0.3, 0.1, -0.7);
    expect(out[0]).toBe(5); expect(out[1]).toBeCloseTo(0.714286, 6); expect(out[2]).toBeCloseTo(0.428571, 6);
  });

  it('maps face centres to the axes and corners to the table (inverse table of the Vulkan specification)', () => {
    const d = new Float64Array(3);
    const axes = [[1, 0, 0], [-1, 0, 0], [0, 1, 0], [0, -1, 0], [0, 0, 1], [0, 0, -1]];
    axes.forEach((axis, face) => {
      cubeFaceToDirection(d, 0, face, 0, 0);
      expect([...d].map((v) => v + 0)).toEqual(axis);
    });
    // N = 2, texel (0, 0) (first in memory) per face.
    const firstTexel = [[1, 0.5, 0.5], [-1, 0.5, -0.5], [-0.5, 1, -0.5], [-0.5, -1, 0.5], [-0.5, 0.5, 1], [0.5, 0.5, -1]];
    firstTexel.forEach((expected, face) => {
      cubeTexelCenterDirection(d, 0, face, 0, 0, 2);
      const len = Math.hypot(...expected);
      expected.forEach((v, k) => expect(d[k]).toBeCloseTo(v / len, 12));
    });
    // Corner (u, v) = (-1, -1) of +X is (1, 1, 1): t = 0 row is the top (+Y).
    cubeFaceToDirection(d, 0, 0, -1, -1);
    expect([...d]).toEqual([1, 1, 1]);
  });

  it('round-trips direction -> face/texel -> direction for every face', () => {
    const d = new Float64Array(3);
    const f = new Float64Array(3);
    const size = 7;
    for (let face = 0; face < 6; face++) {
      for (let y = 0; y < size; y++) {
        for (let x = 0; x < size; x++) {
          cubeTexelCenterDirection(d, 0, face, x, y, size);
          directionToCubeFace(f, 0, d[0]!, d[1]!, d[2]!);
          expect(f[0]).toBe(face);
          expect(f[1]! * size - 0.5).toBeCloseTo(x, 9);
          expect(f[2]! * size - 0.5).toBeCloseTo(y, 9);
        }
      }
    }
  });
});

describe('texel solid angles', () => {
  it('sum to 4 pi over the cube, pi/6 per texel at N = 2 (exact)', () => {
    for (const n of [1, 2, 3, 16, 64, 256]) {
      const table = cubeFaceSolidAngleTable(n);
      let sum = 0;
      for (const v of table) sum += v;
      expect(6 * sum).toBeCloseTo(FOUR_PI, 10);
    }
    expect(cubeTexelSolidAngle(0, 0, 2)).toBeCloseTo(Math.PI / 6, 12);
    const row0 = [0.081456, 0.120393, 0.120393, 0.081456];
    const row1 = [0.120393, 0.201358, 0.201358, 0.120393];
    row0.forEach((v, x) => expect(cubeTexelSolidAngle(x, 0, 4)).toBeCloseTo(v, 6));
    row1.forEach((v, x) => expect(cubeTexelSolidAngle(x, 1, 4)).toBeCloseTo(v, 6));
  });

  it('agree with direct quadrature of the area element 1/(1+u^2+v^2)^(3/2)', () => {
    const n = 5;
    const h = 2 / n;
    const numeric = integrate2d((u, v) => Math.pow(1 + u * u + v * v, -1.5), -1 + h, -1 + 2 * h, -1 + 3 * h, -1 + 4 * h, 4, 4);
    expect(cubeTexelSolidAngle(1, 3, n)).toBeCloseTo(numeric, 12);
  });

  it('equirect rows sum to 4 pi and match the 8x4 example (exact)', () => {
    const rows = [0.230038, 0.555360, 0.555360, 0.230038];
    rows.forEach((v, j) => expect(equirectPixelSolidAngle(8, 4, j)).toBeCloseTo(v, 6));
    let sum = 0;
    for (let j = 0; j < 512; j++) sum += 1024 * equirectPixelSolidAngle(1024, 512, j);
    expect(sum).toBeCloseTo(FOUR_PI, 10);
  });
});

describe('equirectangular mapping (README, Conventions)', () => {
  it('puts -Z at the centre, +X at u = 0.75 and +Y on row 0', () => {
    const uv = new Float64Array(2);
    directionToEquirect(uv, 0, 0, 0, -1);
    expect([uv[0], uv[1]]).toEqual([0.5, 0.5]);
    directionToEquirect(uv, 0, 1, 0, 0);
    expect(uv[0]).toBeCloseTo(0.75, 14);
    directionToEquirect(uv, 0, 0, 1, 0);
    expect(uv[1]).toBe(0);
  });

  it('round-trips (u, v) -> direction -> (u, v)', () => {
    const d = new Float64Array(3);
    const uv = new Float64Array(2);
    for (let i = 1; i < 40; i++) {
      for (let j = 1; j < 20; j++) {
        equirectToDirection(d, 0, i / 40, j / 20);
        directionToEquirect(uv, 0, d[0]!, d[1]!, d[2]!);
        expect(uv[0]).toBeCloseTo(i / 40, 12);
        expect(uv[1]).toBeCloseTo(j / 20, 12);
      }
    }
  });
});
