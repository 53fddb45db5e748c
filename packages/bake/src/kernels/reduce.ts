/**
 * Stage 3 kernel: one step of the source pyramid. A parent texel is the solid-angle-weighted mean of its
 * 2 x 2 children, so every level keeps the radiance integral of the level above (exact texel solid
 * angles, REFERENCES.md sec. 9).
 */

import { cubeTexelSolidAngle } from '@lightkiln/math';
import type { SharedBuffers } from '@lightkiln/pool';

export interface ReduceParams {
  /** Parent face size; the child level has 2 * size. */
  readonly size: number;
  readonly srcOffset: number;
  readonly dstOffset: number;
}

/** buffers.pyramid: all levels concatenated (RGB float64); items are parent texels of this level. */
export function reducePyramid(buffers: SharedBuffers, begin: number, end: number, params: ReduceParams): void {
  const pyr = buffers.pyramid as Float64Array;
  const size = params.size;
  const child = size * 2;
  const perFace = size * size;
  for (let i = begin; i < end; i++) {
    const face = (i / perFace) | 0;
    const rem = i - face * perFace;
    const y = (rem / size) | 0;
    const x = rem - y * size;
    let r = 0;
    let g = 0;
    let b = 0;
    let wsum = 0;
    for (let dy = 0; dy < 2; dy++) {
      for (let dx = 0; dx < 2; dx++) {
        const cx = 2 * x + dx;
        const cy = 2 * y + dy;
        const w = cubeTexelSolidAngle(cx, cy, child);
        const o = params.srcOffset + ((face * child + cy) * child + cx) * 3;
        r += pyr[o]! * w;
        g += pyr[o + 1]! * w;
        b += pyr[o + 2]! * w;
        wsum += w;
      }
    }
    const o = params.dstOffset + i * 3;
    pyr[o] = r / wsum;
    pyr[o + 1] = g / wsum;
    pyr[o + 2] = b / wsum;
  }
}
