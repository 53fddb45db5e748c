/** Format detection from magic bytes, and one entry point that decodes any supported image. */

import { CodecError } from './errors.js';
import { decodeExr } from './exr.js';
import { decodeHdr } from './hdr.js';
import type { DecodedImage, DecodeLimits } from './image.js';
import { decodePfm } from './pfm.js';
import { KTX2_IDENTIFIER } from './ktx2.js';

export type SniffedFormat = 'hdr' | 'exr' | 'pfm' | 'ktx2' | 'png';

/** The format of a byte string by its signature, or null. */
export function sniffFormat(bytes: Uint8Array): SniffedFormat | null {
  if (bytes.length >= 2 && bytes[0] === 0x23 && bytes[1] === 0x3f) return 'hdr'; // "#?"
  if (bytes.length >= 4 && bytes[0] === 0x76 && bytes[1] === 0x2f && bytes[2] === 0x31 && bytes[3] === 0x01) return 'exr';
  if (bytes.length >= 3 && bytes[0] === 0x50 && (bytes[1] === 0x46 || bytes[1] === 0x66) && (bytes[2] === 0x0a || bytes[2] === 0x0d || bytes[2] === 0x20)) return 'pfm';
  if (bytes.length >= 12 && KTX2_IDENTIFIER.every((b, i) => bytes[i] === b)) return 'ktx2';
  if (bytes.length >= 8 && bytes[0] === 0x89 && bytes[1] === 0x50 && bytes[2] === 0x4e && bytes[3] === 0x47) return 'png';
  return null;
}

export interface DecodeImageOptions {
  readonly file?: string;
  readonly limits?: DecodeLimits;
}

/** Decodes an .hdr, .exr or .pfm image by its signature. KTX 2.0 cubemaps go through decodeKtx2. */
export function decodeImage(bytes: Uint8Array, options: DecodeImageOptions = {}): DecodedImage {
  const file = options.file ?? 'input';
  const format = sniffFormat(bytes);
  switch (format) {
    case 'hdr': return decodeHdr(bytes, { file, ...(options.limits ? { limits: options.limits } : {}) });
    case 'exr': return decodeExr(bytes, { file, ...(options.limits ? { limits: options.limits } : {}) });
    case 'pfm': return decodePfm(bytes, { file, ...(options.limits ? { limits: options.limits } : {}) });
    case 'ktx2': throw new CodecError('UNSUPPORTED_FORMAT', file, 'a KTX 2.0 texture is not a flat image; read it with decodeKtx2');
    case 'png': throw new CodecError('UNSUPPORTED_FORMAT', file, 'PNG holds 8-bit display colours, not HDR radiance; use .hdr, .exr or .pfm');
    default: throw new CodecError('UNSUPPORTED_FORMAT', file, 'unknown image format (expected Radiance .hdr, OpenEXR or PFM)');
  }
}
