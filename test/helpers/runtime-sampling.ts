/**
 * What a shader sees: sampling a prefiltered cubemap chain the way a GPU does with
 * textureLod(cube, d, lod): trilinear between the two levels around lod, bilinear within a level with
 * seamless cube filtering (Vulkan specification, "Cube Map Edge Handling": a tap past a face edge reads the
 * neighbouring face; a tap past a corner takes the average of the three texels that meet there). Face
 * selection and the (s, t) convention are the file's (KTX 2.0 / Vulkan "Cube Map Face Selection").
 */

import { cubeFaceToDirection, directionToCubeFace } from '@lightkiln/math';

export interface ChainLevel {
  /** Face size and RGB(A) texels, faces one after another, rows top first. */
  readonly size: number;
  readonly channels: number;
  readonly data: ArrayLike<number>;
}

const sel = new Float64Array(3);
const dir = new Float64Array(3);

/** Texel of `level` that a tap (face, x, y) reads, x and y possibly one past an edge: [face, x, y]. */
function wrapTap(face: number, x: number, y: number, n: number): [number, number, number] {
  if (x >= 0 && x < n && y >= 0 && y < n) return [face, x, y];
  // The tap's texel centre on the face's extended plane, then the face that direction selects.
  cubeFaceToDirection(dir, 0, face, (2 * (x + 0.5)) / n - 1, (2 * (y + 0.5)) / n - 1);
  directionToCubeFace(sel, 0, dir[0]!, dir[1]!, dir[2]!);
  const f = sel[0]!;
  const tx = Math.min(n - 1, Math.max(0, Math.floor(sel[1]! * n)));
  const ty = Math.min(n - 1, Math.max(0, Math.floor(sel[2]! * n)));
  return [f, tx, ty];
}

function fetch(out: Float64Array, level: ChainLevel, face: number, x: number, y: number, w: number): void {
  const n = level.size;
  const c = level.channels;
  const inX = x >= 0 && x < n;
  const inY = y >= 0 && y < n;
  if (!inX && !inY) {
    // Corner: the three texels that meet at the cube corner, averaged.
    const cx = Math.min(n - 1, Math.max(0, x));
    const cy = Math.min(n - 1, Math.max(0, y));
    const taps = [wrapTap(face, cx, cy, n), wrapTap(face, x, cy, n), wrapTap(face, cx, y, n)];
    for (const [f, tx, ty] of taps) {
      const o = ((f * n + ty) * n + tx) * c;
      for (let k = 0; k < 3; k++) out[k] = out[k]! + (w / 3) * level.data[o + k]!;
    }
    return;
  }
  const [f, tx, ty] = wrapTap(face, x, y, n);
  const o = ((f * n + ty) * n + tx) * c;
  for (let k = 0; k < 3; k++) out[k] = out[k]! + w * level.data[o + k]!;
}

/** Bilinear, seamless: adds weight * value(d) to out[0..2]. */
export function sampleLevel(out: Float64Array, level: ChainLevel, dx: number, dy: number, dz: number, weight: number): void {
  directionToCubeFace(sel, 0, dx, dy, dz);
  const face = sel[0]!;
  const n = level.size;
  const fx = sel[1]! * n - 0.5;
  const fy = sel[2]! * n - 0.5;
  const x0 = Math.floor(fx);
  const y0 = Math.floor(fy);
  const ax = fx - x0;
  const ay = fy - y0;
  fetch(out, level, face, x0, y0, weight * (1 - ax) * (1 - ay));
  fetch(out, level, face, x0 + 1, y0, weight * ax * (1 - ay));
  fetch(out, level, face, x0, y0 + 1, weight * (1 - ax) * ay);
  fetch(out, level, face, x0 + 1, y0 + 1, weight * ax * ay);
}

/** textureLod: trilinear between the levels around lod (clamped to the chain); writes RGB to out. */
export function sampleChain(out: Float64Array, chain: readonly ChainLevel[], dx: number, dy: number, dz: number, lod: number): void {
  out[0] = 0; out[1] = 0; out[2] = 0;
  const l = Math.min(chain.length - 1, Math.max(0, lod));
  const l0 = Math.floor(l);
  const l1 = Math.min(chain.length - 1, l0 + 1);
  const t = l - l0;
  sampleLevel(out, chain[l0]!, dx, dy, dz, l1 === l0 ? 1 : 1 - t);
  if (l1 !== l0 && t > 0) sampleLevel(out, chain[l1]!, dx, dy, dz, t);
}
