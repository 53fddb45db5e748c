/** Stage 7: GPU files (KTX 2.0) and inspection views of the baked data. */

import { encodeKtx2, ktx2FormatInfo, packRgbTexels, type FloatImage, type Ktx2Format, type Ktx2LevelPacker } from '@lightkiln/codecs';
import type { CubeFormat } from '../recipe.js';
import type { DfgTable } from './dfg.js';

export const WRITER = 'lightkiln 0.1.0';

/**
 * Largest finite value of each channel a cube format stores (IEEE 754 binary16: 65504; RGB9E5: 65408;
 * B10G11R11: 65024 for the 11-bit R and G, 64512 for the 10-bit B; float32: 3.4028235e38).
 */
export const FORMAT_MAX: Readonly<Record<CubeFormat, readonly [number, number, number]>> = {
  rgba16f: [65504, 65504, 65504],
  rgba32f: [3.4028234663852886e38, 3.4028234663852886e38, 3.4028234663852886e38],
  rgb9e5: [65408, 65408, 65408],
  b10g11r11: [65024, 65024, 64512],
};

/**
 * A cube (all levels) as KTX 2.0, and how many texels were clamped to the format's range (each level is
 * packed from its RGB floats straight into the format: alpha 1, channels clamped to FORMAT_MAX so no
 * artifact holds Inf).
 */
export function encodeCubeKtx2(levels: readonly Float32Array[], size: number, format: CubeFormat, supercompression: 'none' | 'zlib' | 'zstd', keyValues: Record<string, string>): { bytes: Uint8Array; clamped: number } {
  let clamped = 0;
  const bytesPerTexel = ktx2FormatInfo(format as Ktx2Format).bytesPerTexel;
  // Each level packs itself where the file wants it (uncompressed: straight into the file, so a level is
  // never held both packed and in the file; a 1024 cube's levels are 67 MB as rgba16f).
  const packers: Ktx2LevelPacker[] = levels.map((l) => ({
    byteLength: (l.length / 3) * bytesPerTexel,
    pack: (target: Uint8Array) => {
      clamped += packRgbTexels(format as Ktx2Format, l, FORMAT_MAX[format], target).clamped;
    },
  }));
  const bytes = encodeKtx2({ format: format as Ktx2Format, width: size, height: size, faceCount: 6, levels: packers, supercompression, writer: WRITER, keyValues });
  return { bytes, clamped };
}

export function encodeDfgKtx2(table: DfgTable, supercompression: 'none' | 'zlib' | 'zstd', samples: number): Uint8Array {
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
