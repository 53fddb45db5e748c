/** Stage 7: GPU files (KTX 2.0) and inspection views of the baked data. */

import { encodeKtx2, type FloatImage, type Ktx2Format } from '@lightkiln/codecs';
import type { CubeFormat } from '../recipe.js';
import type { DfgTable } from './dfg.js';

export const WRITER = 'lightkiln 0.1.0';

/** RGB texels to the channel count of a format (alpha = 1 for the RGBA formats). */
function toFormatChannels(rgb: Float32Array, format: CubeFormat): Float32Array {
  if (format === 'rgb9e5' || format === 'b10g11r11') return rgb;
  const n = rgb.length / 3;
  const out = new Float32Array(n * 4);
  for (let t = 0; t < n; t++) {
    out[t * 4] = rgb[t * 3]!;
    out[t * 4 + 1] = rgb[t * 3 + 1]!;
    out[t * 4 + 2] = rgb[t * 3 + 2]!;
    out[t * 4 + 3] = 1;
  }
  return out;
}

export function encodeCubeKtx2(levels: readonly Float32Array[], size: number, format: CubeFormat, supercompression: 'none' | 'zlib', keyValues: Record<string, string>): Uint8Array {
  return encodeKtx2({
    format: format as Ktx2Format,
    width: size,
    height: size,
    faceCount: 6,
    levels: levels.map((l) => toFormatChannels(l, format)),
    supercompression,
    writer: WRITER,
    keyValues,
  });
}

export function encodeDfgKtx2(table: DfgTable, supercompression: 'none' | 'zlib', samples: number): Uint8Array {
  return encodeKtx2({
    format: table.channels === 2 ? 'rg16f' : 'rgba16f',
    width: table.size,
    height: table.size,
    faceCount: 1,
    levels: [table.data],
    supercompression,
    writer: WRITER,
    keyValues: {
      'lightkiln.channels': table.channelNames.join(','),
      'lightkiln.axes': 'column i: n.v = (i + 0.5) / width; row j: perceptual roughness = (j + 0.5) / height, row 0 smoothest',
      'lightkiln.model': 'GGX, height-correlated Smith visibility, Schlick Fresnel; specular = F0 * A + f90 * B',
      'lightkiln.samples': String(samples),
    },
  });
}

/**
 * Unfolds the six faces of a cube level into a 4N x 3N horizontal cross (+Y above +Z, -Y below;
 * -X, +Z, +X, -Z across), each face as stored (row 0 at the top), for inspection only.
 */
export function cubeCross(rgb: Float32Array, size: number): FloatImage {
  const width = 4 * size;
  const height = 3 * size;
  const data = new Float32Array(width * height * 3);
  const place: [number, number, number][] = [[0, 2, 1], [1, 0, 1], [2, 1, 0], [3, 1, 2], [4, 1, 1], [5, 3, 1]];
  for (const [face, cx, cy] of place) {
    for (let y = 0; y < size; y++) {
      const src = (face * size + y) * size * 3;
      const dst = ((cy * size + y) * width + cx * size) * 3;
      data.set(rgb.subarray(src, src + size * 3), dst);
    }
  }
  return { width, height, channels: 3, data };
}
