/**
 * Stage 2 kernels: area-correct resampling of the source onto the level-0 cube. Each destination texel
 * averages k x k stratified points of its footprint, each weighted by the face's solid-angle element
 * (1 + u^2 + v^2)^(-3/2), with bilinear source fetches; the rotation about +Y is applied here.
 */

import { CUBE_FACE_BASIS, directionToCubeFace, INV_TWO_PI, INV_PI } from '@lightkiln/math';
import type { SharedBuffers } from '@lightkiln/pool';
import { fetchFaceBilinear } from './cube-fetch.js';

export interface ResampleParams {
  readonly size: number;
  /** Supersamples per axis per destination texel. */
  readonly supersample: number;
  /** cos and sin of the rotation angle (positive turns +Z towards +X). */
  readonly rotCos: number;
  readonly rotSin: number;
  /** Equirect source size (equirect kernel) or source cube face size (cube kernel). */
  readonly srcWidth: number;
  readonly srcHeight: number;
}

/** buffers.src: equirect RGB float32 (W x H, row 0 = +Y); buffers.dst: cube RGB float32. */
export function resampleEquirect(buffers: SharedBuffers, begin: number, end: number, params: ResampleParams): void {
  const src = buffers.src as Float32Array;
  const dst = buffers.dst as Float64Array;
  const size = params.size;
  const k = params.supersample;
  const c = params.rotCos;
  const sn = params.rotSin;
  const W = params.srcWidth;
  const H = params.srcHeight;
  const B = CUBE_FACE_BASIS;
  const perFace = size * size;
  for (let i = begin; i < end; i++) {
    const face = (i / perFace) | 0;
    const rem = i - face * perFace;
    const ty = (rem / size) | 0;
    const tx = rem - ty * size;
    const b = face * 9;
    let r = 0;
    let g = 0;
    let bl = 0;
    let wsum = 0;
    for (let sy = 0; sy < k; sy++) {
      const v = (2 * (ty + (sy + 0.5) / k)) / size - 1;
      for (let sx = 0; sx < k; sx++) {
        const u = (2 * (tx + (sx + 0.5) / k)) / size - 1;
        const q = 1 + u * u + v * v;
        const w = 1 / (q * Math.sqrt(q));
        const inv = 1 / Math.sqrt(q);
        const dx = (B[b]! + u * B[b + 3]! + v * B[b + 6]!) * inv;
        const dy = (B[b + 1]! + u * B[b + 4]! + v * B[b + 7]!) * inv;
        const dz = (B[b + 2]! + u * B[b + 5]! + v * B[b + 8]!) * inv;
        // Source direction R(-angle) d.
        const sxd = dx * c - dz * sn;
        const szd = dx * sn + dz * c;
        let fu = (0.5 + Math.atan2(sxd, -szd) * INV_TWO_PI) * W - 0.5;
        let fv = Math.acos(dy > 1 ? 1 : dy < -1 ? -1 : dy) * INV_PI * H - 0.5;
        if (fv < 0) fv = 0; else if (fv > H - 1) fv = H - 1;
        if (fu < 0) fu += W;
        const x0 = Math.floor(fu);
        const y0 = fv | 0;
        const ax = fu - x0;
        const ay = fv - y0;
        const xa = x0 >= W ? x0 - W : x0;
        const xb = xa + 1 >= W ? 0 : xa + 1;
        const y1 = y0 + 1 < H ? y0 + 1 : y0;
        const i00 = (y0 * W + xa) * 3;
        const i10 = (y0 * W + xb) * 3;
        const i01 = (y1 * W + xa) * 3;
        const i11 = (y1 * W + xb) * 3;
        const w00 = (1 - ax) * (1 - ay) * w;
        const w10 = ax * (1 - ay) * w;
        const w01 = (1 - ax) * ay * w;
        const w11 = ax * ay * w;
        r += src[i00]! * w00 + src[i10]! * w10 + src[i01]! * w01 + src[i11]! * w11;
        g += src[i00 + 1]! * w00 + src[i10 + 1]! * w10 + src[i01 + 1]! * w01 + src[i11 + 1]! * w11;
        bl += src[i00 + 2]! * w00 + src[i10 + 2]! * w10 + src[i01 + 2]! * w01 + src[i11 + 2]! * w11;
        wsum += w;
      }
    }
    const o = i * 3;
    dst[o] = r / wsum;
    dst[o + 1] = g / wsum;
    dst[o + 2] = bl / wsum;
  }
}

/** buffers.src: source cube RGB float32 of face size srcWidth; buffers.dst: cube RGB float32. */
export function resampleCube(buffers: SharedBuffers, begin: number, end: number, params: ResampleParams): void {
  const src = buffers.src as Float32Array;
  const dst = buffers.dst as Float64Array;
  const size = params.size;
  const k = params.supersample;
  const c = params.rotCos;
  const sn = params.rotSin;
  const srcSize = params.srcWidth;
  const B = CUBE_FACE_BASIS;
  const perFace = size * size;
  const sel = new Float64Array(3);
  const acc = new Float64Array(3);
  for (let i = begin; i < end; i++) {
    const face = (i / perFace) | 0;
    const rem = i - face * perFace;
    const ty = (rem / size) | 0;
    const tx = rem - ty * size;
    const b = face * 9;
    acc[0] = 0; acc[1] = 0; acc[2] = 0;
    let wsum = 0;
    for (let sy = 0; sy < k; sy++) {
      const v = (2 * (ty + (sy + 0.5) / k)) / size - 1;
      for (let sx = 0; sx < k; sx++) {
        const u = (2 * (tx + (sx + 0.5) / k)) / size - 1;
        const q = 1 + u * u + v * v;
        const w = 1 / (q * Math.sqrt(q));
        const dx = B[b]! + u * B[b + 3]! + v * B[b + 6]!;
        const dy = B[b + 1]! + u * B[b + 4]! + v * B[b + 7]!;
        const dz = B[b + 2]! + u * B[b + 5]! + v * B[b + 8]!;
        directionToCubeFace(sel, 0, dx * c - dz * sn, dy, dx * sn + dz * c);
        fetchFaceBilinear(acc, src, 0, srcSize, sel[0]!, sel[1]!, sel[2]!, w);
        wsum += w;
      }
    }
    const o = i * 3;
    dst[o] = acc[0]! / wsum;
    dst[o + 1] = acc[1]! / wsum;
    dst[o + 2] = acc[2]! / wsum;
  }
}
