/** The in-memory image every codec produces and consumes, and the decode limits checked before work. */

import { CodecError } from './errors.js';

/** A linear float image, channels interleaved, row 0 first as stored top-down. */
export interface FloatImage {
  readonly width: number;
  readonly height: number;
  /** 1 (grey), 3 (RGB) or 4 (RGBA). */
  readonly channels: number;
  readonly data: Float32Array;
}

/** Counts of values a bake may need to sanitise. Decoders report; the bake decides the policy. */
export interface PixelIssues {
  readonly nan: number;
  readonly infinite: number;
  readonly negative: number;
}

export interface DecodedImage extends FloatImage {
  readonly format: 'hdr' | 'exr' | 'pfm' | 'ktx2';
  /** NaN, infinite and negative samples (counted on first read: callers that repair pixels anyway skip the pass). */
  readonly issues: PixelIssues;
}

/** A decoded image whose `issues` are counted when first read (over the pixels as they are then). */
export function decodedImage(width: number, height: number, channels: number, data: Float32Array, format: DecodedImage['format']): DecodedImage {
  let issues: PixelIssues | undefined;
  return {
    width, height, channels, data, format,
    get issues(): PixelIssues {
      issues ??= countPixelIssues(data);
      return issues;
    },
  };
}

export interface DecodeLimits {
  /** Largest width * height accepted. Default 67 108 864 (8192 x 8192): 1 GiB of RGBA float32. */
  readonly maxPixels?: number;
  /** Largest width or height. Default 65 536. */
  readonly maxDimension?: number;
  /** Largest input size in bytes. Default 2 GiB. */
  readonly maxBytes?: number;
  /**
   * Largest memory a decoder may allocate for one image: the decoded float32 pixels plus its largest
   * working buffer (an EXR chunk of every channel in the file, say), computed from the header before any
   * allocation. Default 1.25 GiB (an 8192 x 8192 RGB image and its buffers fit).
   */
  readonly maxDecodeMemory?: number;
}

export interface ResolvedDecodeLimits {
  readonly maxPixels: number;
  readonly maxDimension: number;
  readonly maxBytes: number;
  readonly maxDecodeMemory: number;
}

export const DEFAULT_DECODE_LIMITS: ResolvedDecodeLimits = Object.freeze({
  maxPixels: 8192 * 8192,
  maxDimension: 65536,
  maxBytes: 2 * 1024 * 1024 * 1024,
  maxDecodeMemory: 1.25 * 1024 * 1024 * 1024,
});

export function resolveDecodeLimits(limits: DecodeLimits | undefined): ResolvedDecodeLimits {
  return { ...DEFAULT_DECODE_LIMITS, ...(limits ?? {}) };
}

/** Throws BAD_DIMENSIONS / LIMIT_EXCEEDED before any pixel memory is allocated. */
export function checkDimensions(file: string, width: number, height: number, limits: ResolvedDecodeLimits): void {
  if (!Number.isSafeInteger(width) || !Number.isSafeInteger(height) || width <= 0 || height <= 0) {
    throw new CodecError('BAD_DIMENSIONS', file, `invalid image size ${width} x ${height}`);
  }
  if (width > limits.maxDimension || height > limits.maxDimension) {
    throw new CodecError('LIMIT_EXCEEDED', file, `image size ${width} x ${height} exceeds the limit of ${limits.maxDimension} per side`);
  }
  if (width * height > limits.maxPixels) {
    throw new CodecError('LIMIT_EXCEEDED', file, `image of ${width * height} pixels exceeds the limit of ${limits.maxPixels} pixels`);
  }
  checkDecodeMemory(file, width * height * 16, limits, `${width} x ${height} pixels of RGBA float32`);
}

/**
 * The float32 pixel array of a decoded image, in shared memory where the platform has it: worker pools
 * then read the image without a copy, and every other use sees an ordinary Float32Array.
 */
export function allocatePixels(count: number): Float32Array {
  return typeof SharedArrayBuffer === 'function' ? new Float32Array(new SharedArrayBuffer(count * 4)) : new Float32Array(count);
}

/** Throws LIMIT_EXCEEDED when a decode would allocate more than limits.maxDecodeMemory bytes. */
export function checkDecodeMemory(file: string, bytes: number, limits: ResolvedDecodeLimits, what: string): void {
  if (!(bytes <= limits.maxDecodeMemory)) {
    throw new CodecError('LIMIT_EXCEEDED', file, `decoding needs about ${(bytes / 2 ** 20).toFixed(0)} MiB (${what}), over the limit of ${(limits.maxDecodeMemory / 2 ** 20).toFixed(0)} MiB`);
  }
}

export function checkByteLength(file: string, length: number, limits: ResolvedDecodeLimits): void {
  if (length > limits.maxBytes) {
    throw new CodecError('LIMIT_EXCEEDED', file, `file of ${length} bytes exceeds the limit of ${limits.maxBytes} bytes`);
  }
}

/** Counts NaN, infinite and negative values in the colour channels (alpha included). */
export function countPixelIssues(data: Float32Array): PixelIssues {
  let nan = 0;
  let infinite = 0;
  let negative = 0;
  for (let i = 0; i < data.length; i++) {
    const v = data[i]!;
    if (v !== v) nan++;
    else if (v === Infinity || v === -Infinity) infinite++;
    else if (v < 0) negative++;
  }
  return { nan, infinite, negative };
}

/** Validates an image handed to an encoder. */
export function checkImage(file: string, image: FloatImage, allowedChannels: readonly number[]): void {
  const { width, height, channels, data } = image;
  if (!Number.isInteger(width) || !Number.isInteger(height) || width <= 0 || height <= 0) {
    throw new CodecError('INVALID_ARGUMENT', file, `invalid image size ${width} x ${height}`);
  }
  if (!allowedChannels.includes(channels)) {
    throw new CodecError('INVALID_ARGUMENT', file, `images with ${channels} channels cannot be written in this format (allowed: ${allowedChannels.join(', ')})`);
  }
  if (data.length !== width * height * channels) {
    throw new CodecError('INVALID_ARGUMENT', file, `pixel array holds ${data.length} values, expected ${width * height * channels}`);
  }
}
