/**
 * Brute-force convolutions over every texel of a source cube level: the `reference` specular mode (ground
 * truth for tests and the sample-budget sweep) and the direct cosine convolution of the irradiance cube.
 * buffers.srcDirs holds per source texel (x, y, z, solid angle) as float64 (exact texel solid angles).
 */

import type { SharedBuffers } from '@lightkiln/pool';

export interface ConvolveParams {
  /** Float offset of the source level in buffers.pyramid and its texel count. */
  readonly srcOffset: number;
  readonly srcTexels: number;
  /** Output face size, first item of this output level and float offset in buffers.dst. */
  readonly size: number;
  readonly levelBegin: number;
  readonly dstOffset: number;
  /** GGX alpha for the specular reference; unused for irradiance. */
  readonly alpha: number;
}

function centreDirection(out: Float64Array, face: number, tx: number, ty: number, size: number): void {
  const u = (2 * (tx + 0.5)) / size - 1;
  const v = (2 * (ty + 0.5)) / size - 1;
  let x: number;
  let y: number;
  let z: number;
  switch (face) {
    case 0: x = 1; y = -v; z = -u; break;
    case 1: x = -1; y = -v; z = u; break;
    case 2: x = u; y = 1; z = v; break;
    case 3: x = u; y = -1; z = -v; break;
    case 4: x = u; y = -v; z = 1; break;
    default: x = -u; y = -v; z = -1; break;
  }
  const inv = 1 / Math.sqrt(x * x + y * y + z * z);
  out[0] = x * inv;
  out[1] = y * inv;
  out[2] = z * inv;
}

/**
 * Reference LD(n) = sum_j L_j D(h_j) (n.l_j) dOmega_j / sum_j D(h_j) (n.l_j) dOmega_j with n = v,
 * where (n.h)^2 = (1 + n.l) / 2 (half-angle identity) and D is GGX (Walter et al. 2007).
 */
export function referenceSpecular(buffers: SharedBuffers, begin: number, end: number, params: ConvolveParams): void {
  const pyr = buffers.pyramid as Float64Array;
  const dirs = buffers.srcDirs as Float64Array;
  const dst = buffers.dst as Float32Array;
  const size = params.size;
  const perFace = size * size;
  const a2 = params.alpha * params.alpha;
  const count = params.srcTexels;
  const src0 = params.srcOffset;
  const n = new Float64Array(3);
  for (let item = begin; item < end; item++) {
    const local = item - params.levelBegin;
    const face = (local / perFace) | 0;
    const rem = local - face * perFace;
    const ty = (rem / size) | 0;
    centreDirection(n, face, rem - ty * size, ty, size);
    const nx = n[0]!;
    const ny = n[1]!;
    const nz = n[2]!;
    let r = 0;
    let g = 0;
    let b = 0;
    let wsum = 0;
    for (let j = 0; j < count; j++) {
      const nl = nx * dirs[4 * j]! + ny * dirs[4 * j + 1]! + nz * dirs[4 * j + 2]!;
      if (nl <= 0) continue;
      const nh2 = (1 + nl) * 0.5;
      const d = nh2 * (a2 - 1) + 1;
      const w = (a2 / (d * d)) * nl * dirs[4 * j + 3]!; // 1/pi cancels in the ratio
      const o = src0 + j * 3;
      r += pyr[o]! * w;
      g += pyr[o + 1]! * w;
      b += pyr[o + 2]! * w;
      wsum += w;
    }
    const o = params.dstOffset + local * 3;
    dst[o] = r / wsum;
    dst[o + 1] = g / wsum;
    dst[o + 2] = b / wsum;
  }
}

/**
 * Irradiance E(n) = integral L max(0, n.l) dl (E, not E / pi) as a normalised quadrature:
 * pi * sum_j L_j w_j / sum_j w_j with w_j = max(0, n.l_j) dOmega_j, using integral max(0, n.l) dl = pi,
 * so a constant environment gives exactly pi L despite texels straddling the horizon.
 */
export function convolveIrradiance(buffers: SharedBuffers, begin: number, end: number, params: ConvolveParams): void {
  const pyr = buffers.pyramid as Float64Array;
  const dirs = buffers.srcDirs as Float64Array;
  const dst = buffers.dst as Float32Array;
  const size = params.size;
  const perFace = size * size;
  const count = params.srcTexels;
  const src0 = params.srcOffset;
  const n = new Float64Array(3);
  for (let item = begin; item < end; item++) {
    const local = item - params.levelBegin;
    const face = (local / perFace) | 0;
    const rem = local - face * perFace;
    const ty = (rem / size) | 0;
    centreDirection(n, face, rem - ty * size, ty, size);
    const nx = n[0]!;
    const ny = n[1]!;
    const nz = n[2]!;
    let r = 0;
    let g = 0;
    let b = 0;
    let wsum = 0;
    for (let j = 0; j < count; j++) {
      const nl = nx * dirs[4 * j]! + ny * dirs[4 * j + 1]! + nz * dirs[4 * j + 2]!;
      if (nl <= 0) continue;
      const w = nl * dirs[4 * j + 3]!;
      const o = src0 + j * 3;
      r += pyr[o]! * w;
      g += pyr[o + 1]! * w;
      b += pyr[o + 2]! * w;
      wsum += w;
    }
    const o = params.dstOffset + local * 3;
    const k = Math.PI / wsum;
    dst[o] = r * k;
    dst[o + 1] = g * k;
    dst[o + 2] = b * k;
  }
}
