/**
 * Portable Float Map (PFM): "PF" (RGB) or "Pf" (grey), "W H", then a scale whose sign gives the byte order
 * (negative = little-endian) and float32 samples with rows stored bottom to top (common practice; no
 * single standard). Decoded images are top row first like every other codec.
 */

import { badMagic, corrupt, truncated } from './errors.js';
import { allocatePixels, checkByteLength, checkDimensions, checkImage, decodedImage, resolveDecodeLimits, type DecodedImage, type DecodeLimits, type FloatImage } from './image.js';

const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

export interface PfmDecodeOptions {
  readonly file?: string;
  readonly limits?: DecodeLimits;
}

export function decodePfm(bytes: Uint8Array, options: PfmDecodeOptions = {}): DecodedImage {
  const file = options.file ?? 'input.pfm';
  const limits = resolveDecodeLimits(options.limits);
  checkByteLength(file, bytes.length, limits);
  if (bytes.length < 2 || bytes[0] !== 0x50 || (bytes[1] !== 0x46 && bytes[1] !== 0x66)) throw badMagic(file, 'a PFM file');
  const channels = bytes[1] === 0x46 ? 3 : 1;
  // Three whitespace-separated tokens after the magic, then exactly one whitespace byte.
  let pos = 2;
  const tokens: string[] = [];
  while (tokens.length < 3) {
    while (pos < bytes.length && pos < 256 && /\s/.test(String.fromCharCode(bytes[pos]!))) pos++;
    const start = pos;
    while (pos < bytes.length && pos < 256 && !/\s/.test(String.fromCharCode(bytes[pos]!))) pos++;
    if (pos >= bytes.length) throw truncated(file, 'in the header');
    if (pos >= 256) throw corrupt(file, 'header longer than 256 bytes');
    tokens.push(new TextDecoder('latin1').decode(bytes.subarray(start, pos)));
  }
  pos++; // the single whitespace byte before the raster
  const width = Number(tokens[0]);
  const height = Number(tokens[1]);
  const scale = Number(tokens[2]);
  if (!/^\d+$/.test(tokens[0]!) || !/^\d+$/.test(tokens[1]!)) throw corrupt(file, `invalid size "${tokens[0]} ${tokens[1]}"`);
  if (!Number.isFinite(scale) || scale === 0) throw corrupt(file, `invalid scale "${tokens[2]}"`);
  checkDimensions(file, width, height, limits);
  const need = width * height * channels * 4;
  if (bytes.length - pos < need) throw truncated(file, `in the raster (${bytes.length - pos} of ${need} bytes)`);
  const little = scale < 0;
  const data = allocatePixels(width * height * channels);
  const rowValues = width * channels;
  if (little === HOST_LITTLE_ENDIAN) {
    // The file's byte order is the machine's: each row is a plain byte copy (the bits of every float kept).
    const out = new Uint8Array(data.buffer, data.byteOffset, data.byteLength);
    const rowBytes = rowValues * 4;
    for (let stored = 0; stored < height; stored++) {
      out.set(bytes.subarray(pos + stored * rowBytes, pos + (stored + 1) * rowBytes), (height - 1 - stored) * rowBytes);
    }
  } else {
    const view = new DataView(bytes.buffer, bytes.byteOffset + pos, need);
    for (let stored = 0; stored < height; stored++) {
      const row = height - 1 - stored;
      for (let k = 0; k < rowValues; k++) data[row * rowValues + k] = view.getFloat32((stored * rowValues + k) * 4, little);
    }
  }
  return decodedImage(width, height, channels, data, 'pfm');
}

export interface PfmEncodeOptions {
  readonly file?: string;
  /** Byte order of the samples; default little-endian (scale -1). */
  readonly littleEndian?: boolean;
}

/** Encodes a grey or RGB image (RGBA drops alpha) as PFM, bottom row first. */
export function encodePfm(image: FloatImage, options: PfmEncodeOptions = {}): Uint8Array {
  const file = options.file ?? 'output.pfm';
  checkImage(file, image, [1, 3, 4]);
  const { width, height, channels, data } = image;
  const outChannels = channels === 1 ? 1 : 3;
  const little = options.littleEndian ?? true;
  const head = new TextEncoder().encode(`${outChannels === 3 ? 'PF' : 'Pf'}\n${width} ${height}\n${little ? '-1.0' : '1.0'}\n`);
  const out = new Uint8Array(head.length + width * height * outChannels * 4);
  out.set(head, 0);
  const view = new DataView(out.buffer, head.length);
  let o = 0;
  for (let stored = 0; stored < height; stored++) {
    const row = height - 1 - stored;
    for (let x = 0; x < width; x++) {
      for (let c = 0; c < outChannels; c++, o += 4) view.setFloat32(o, data[(row * width + x) * channels + c]!, little);
    }
  }
  return out;
}
