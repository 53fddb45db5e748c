/** Analytic environments for the bake tests, rendered by our own script into equirect .hdr/.pfm bytes. */

import { encodePfm } from '@lightkiln/codecs';
import { equirectToDirection } from '@lightkiln/math';

export type Radiance = (x: number, y: number, z: number) => [number, number, number];

/** An equirect image of f, each pixel the mean of 4 x 4 points (float32 PFM, no RGBE quantisation). */
export function equirectOf(f: Radiance, width: number, height: number): Uint8Array {
  const data = new Float32Array(width * height * 3);
  const d = new Float64Array(3);
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      let r = 0; let g = 0; let b = 0; let w = 0;
      for (let sy = 0; sy < 4; sy++) {
        for (let sx = 0; sx < 4; sx++) {
          const v = (j + (sy + 0.5) / 4) / height;
          equirectToDirection(d, 0, (i + (sx + 0.5) / 4) / width, v);
          const weight = Math.sin(v * Math.PI);
          const c = f(d[0]!, d[1]!, d[2]!);
          r += c[0] * weight; g += c[1] * weight; b += c[2] * weight; w += weight;
        }
      }
      const o = (j * width + i) * 3;
      data[o] = r / w; data[o + 1] = g / w; data[o + 2] = b / w;
    }
  }
  return encodePfm({ width, height, channels: 3, data });
}

/** Relative RMSE in BT.709 luminance between two RGB arrays (the error convention of the bake README). */
export function relativeRmse(test: Float32Array, ref: Float32Array): number {
  let se = 0;
  let sy = 0;
  const n = ref.length / 3;
  for (let t = 0; t < n; t++) {
    const yr = 0.2126 * ref[t * 3]! + 0.7152 * ref[t * 3 + 1]! + 0.0722 * ref[t * 3 + 2]!;
    const yt = 0.2126 * test[t * 3]! + 0.7152 * test[t * 3 + 1]! + 0.0722 * test[t * 3 + 2]!;
    se += (yt - yr) ** 2;
    sy += yr;
  }
  return Math.sqrt(se / n) / (sy / n);
}
