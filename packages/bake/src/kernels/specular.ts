/**
 * Stage 4 kernel: prefiltered radiance LD(n) for one or more levels by GGX importance sampling with
 * n = v = r (split-sum prefilter, Karis 2013), NoL weights, and filtered importance sampling: each sample
 * reads the source pyramid at its own level of detail, trilinearly (bilinear on two levels), so bright
 * small sources are integrated instead of aliased (Krivanek & Colbert 2008, "Real-time Shading with
 * Filtered Importance Sampling", CGF 27(4)). The level's sample set is the same for every texel and is
 * precomputed (see stages/specular.ts): per sample (lx, ly, lz, NoL, offset0, size0, offset1, size1, frac).
 */

import type { SharedBuffers } from '@lightkiln/pool';

export const SPECULAR_SAMPLE_STRIDE = 9;

export interface SpecularParams {
  /** Item index of this level's first texel and the level's face size. */
  readonly levelBegin: number;
  readonly size: number;
  /** Float offset of this level's texels in buffers.dst. */
  readonly dstOffset: number;
  /** First sample (in samples) of this level in buffers.samples, and the count. */
  readonly sampleOffset: number;
  readonly sampleCount: number;
  /** Firefly clamp: sample luminance above this is scaled down to it; 0 disables. */
  readonly clampLuminance: number;
}

/**
 * buffers.pyramid (RGB float32, all levels), buffers.samples (float64), buffers.dst (RGB float32),
 * buffers.err (float32, one per item: the standard error of the texel's luminance estimate, by the delta
 * method for the ratio estimator sum(w Y) / sum(w): sqrt(sum w^2 (Y - R)^2) / sum w (Cochran 1977,
 * "Sampling Techniques", 3rd ed., sec. 6.4; from memory). It treats the samples as independent, so for the
 * low-discrepancy set it is a conservative (high) estimate.
 */
export function prefilterSpecular(buffers: SharedBuffers, begin: number, end: number, params: SpecularParams): void {
  const pyr = buffers.pyramid as Float32Array;
  const S = buffers.samples as Float64Array;
  const dst = buffers.dst as Float32Array;
  const err = buffers.err as Float32Array;
  const size = params.size;
  const perFace = size * size;
  const levelBegin = params.levelBegin;
  const dstOffset = params.dstOffset;
  const s0 = params.sampleOffset * SPECULAR_SAMPLE_STRIDE;
  const s1 = s0 + params.sampleCount * SPECULAR_SAMPLE_STRIDE;
  const clamp = params.clampLuminance;
  for (let item = begin; item < end; item++) {
    const local = item - levelBegin;
    const face = (local / perFace) | 0;
    const rem = local - face * perFace;
    const ty = (rem / size) | 0;
    const tx = rem - ty * size;
    // Texel centre direction (inverse selection table, Vulkan spec) without a table lookup.
    const u = (2 * (tx + 0.5)) / size - 1;
    const v = (2 * (ty + 0.5)) / size - 1;
    let nx: number;
    let ny: number;
    let nz: number;
    switch (face) {
      case 0: nx = 1; ny = -v; nz = -u; break;
      case 1: nx = -1; ny = -v; nz = u; break;
      case 2: nx = u; ny = 1; nz = v; break;
      case 3: nx = u; ny = -1; nz = -v; break;
      case 4: nx = u; ny = -v; nz = 1; break;
      default: nx = -u; ny = -v; nz = -1; break;
    }
    const inv = 1 / Math.sqrt(nx * nx + ny * ny + nz * nz);
    nx *= inv; ny *= inv; nz *= inv;
    // Duff et al. 2017 orthonormal basis (b1 = t, b2 = b).
    const sign = nz >= 0 ? 1 : -1;
    const a = -1 / (sign + nz);
    const bb = nx * ny * a;
    const tX = 1 + sign * nx * nx * a;
    const tY = sign * bb;
    const tZ = -sign * nx;
    const bX = bb;
    const bY = sign + ny * ny * a;
    const bZ = -ny;
    let r = 0;
    let g = 0;
    let b = 0;
    let wsum = 0;
    let w2 = 0;
    let w2y = 0;
    let w2yy = 0;
    for (let k = s0; k < s1; k += 9) {
      const lx = S[k]!;
      const ly = S[k + 1]!;
      const lz = S[k + 2]!;
      const w = S[k + 3]!;
      const dx = tX * lx + bX * ly + nx * lz;
      const dy = tY * lx + bY * ly + ny * lz;
      const dz = tZ * lx + bZ * ly + nz * lz;
      // Face selection (ties: z, then y, then x).
      const ax = dx < 0 ? -dx : dx;
      const ay = dy < 0 ? -dy : dy;
      const az = dz < 0 ? -dz : dz;
      let f: number;
      let sc: number;
      let tc: number;
      let ma: number;
      if (az >= ay && az >= ax) {
        ma = az; tc = -dy;
        if (dz >= 0) { f = 4; sc = dx; } else { f = 5; sc = -dx; }
      } else if (ay >= ax) {
        ma = ay; sc = dx;
        if (dy >= 0) { f = 2; tc = dz; } else { f = 3; tc = -dz; }
      } else {
        ma = ax; tc = -dy;
        if (dx >= 0) { f = 0; sc = -dz; } else { f = 1; sc = dz; }
      }
      const im = 0.5 / ma;
      const fs = sc * im + 0.5;
      const ft = tc * im + 0.5;
      const frac = S[k + 8]!;
      let sr = 0;
      let sg = 0;
      let sb = 0;
      for (let pass = 0; pass < 2; pass++) {
        const wt = pass === 0 ? 1 - frac : frac;
        if (wt === 0) continue;
        const off = S[k + 4 + 2 * pass]!;
        const n = S[k + 5 + 2 * pass]!;
        const max = n - 1;
        let fx = fs * n - 0.5;
        let fy = ft * n - 0.5;
        if (fx < 0) fx = 0; else if (fx > max) fx = max;
        if (fy < 0) fy = 0; else if (fy > max) fy = max;
        const x0 = fx | 0;
        const y0 = fy | 0;
        const x1 = x0 < max ? 1 : 0;
        const y1 = y0 < max ? n : 0;
        const ex = fx - x0;
        const ey = fy - y0;
        const i00 = off + ((f * n + y0) * n + x0) * 3;
        const i10 = i00 + x1 * 3;
        const i01 = i00 + y1 * 3;
        const i11 = i01 + x1 * 3;
        const w00 = (1 - ex) * (1 - ey) * wt;
        const w10 = ex * (1 - ey) * wt;
        const w01 = (1 - ex) * ey * wt;
        const w11 = ex * ey * wt;
        sr += pyr[i00]! * w00 + pyr[i10]! * w10 + pyr[i01]! * w01 + pyr[i11]! * w11;
        sg += pyr[i00 + 1]! * w00 + pyr[i10 + 1]! * w10 + pyr[i01 + 1]! * w01 + pyr[i11 + 1]! * w11;
        sb += pyr[i00 + 2]! * w00 + pyr[i10 + 2]! * w10 + pyr[i01 + 2]! * w01 + pyr[i11 + 2]! * w11;
      }
      // BT.709 luminance of the sample.
      let lum = 0.2126 * sr + 0.7152 * sg + 0.0722 * sb;
      if (clamp > 0 && lum > clamp) {
        const scale = clamp / lum;
        sr *= scale; sg *= scale; sb *= scale; lum = clamp;
      }
      r += sr * w;
      g += sg * w;
      b += sb * w;
      wsum += w;
      const ww = w * w;
      w2 += ww;
      w2y += ww * lum;
      w2yy += ww * lum * lum;
    }
    const o = dstOffset + local * 3;
    const invW = wsum > 0 ? 1 / wsum : 0;
    dst[o] = r * invW;
    dst[o + 1] = g * invW;
    dst[o + 2] = b * invW;
    const ratio = (0.2126 * r + 0.7152 * g + 0.0722 * b) * invW;
    const variance = w2yy - 2 * ratio * w2y + ratio * ratio * w2;
    err[item] = variance > 0 ? Math.sqrt(variance) * invW : 0;
  }
}
