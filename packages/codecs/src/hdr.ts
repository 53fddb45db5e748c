/**
 * Radiance RGBE (.hdr) files (Ward 1991, "Real Pixels", Graphics Gems II; Radiance "File Formats" doc).
 * Decoding: value = m * 2^(e - 136), e = 0 is black (the common reader convention; README, Conventions); all eight
 * resolution-string orientations are read into top-down, left-to-right order; EXPOSURE is undone.
 * Encoding: round to nearest, new-style run-length scanlines where 8 <= width <= 32767, flat otherwise.
 */

import { floorLog2 } from '@lightkiln/math';
import { badMagic, CodecError, corrupt, truncated, unsupported } from './errors.js';
import { allocatePixels, checkByteLength, checkDimensions, checkImage, decodedImage, resolveDecodeLimits, type DecodedImage, type DecodeLimits, type FloatImage } from './image.js';

export interface HdrHeader {
  /** "#?RADIANCE" or "#?RGBE". */
  readonly programType: string;
  readonly width: number;
  readonly height: number;
  /** Product of every EXPOSURE line (1 when none): stored = true radiance * exposure. */
  readonly exposure: number;
  /** The resolution string as written, e.g. "-Y 512 +X 1024". */
  readonly resolution: string;
  /** Byte offset of the first scanline. */
  readonly dataOffset: number;
  /** Other header variables, e.g. { GAMMA: "1.0" }. */
  readonly variables: Readonly<Record<string, string>>;
}

const MAX_HEADER_BYTES = 65536;
const RESOLUTION = /^([-+])([XY]) (\d+) ([-+])([XY]) (\d+)$/;

/** Reads and validates the header and resolution string; throws CodecError. */
export function readHdrHeader(bytes: Uint8Array, file = 'input.hdr'): HdrHeader {
  let pos = 0;
  const readLine = (): string | null => {
    const start = pos;
    while (pos < bytes.length && pos - start < MAX_HEADER_BYTES && bytes[pos] !== 0x0a) pos++;
    if (pos >= bytes.length) return null;
    if (pos - start >= MAX_HEADER_BYTES) throw corrupt(file, `header line longer than ${MAX_HEADER_BYTES} bytes`);
    const line = new TextDecoder('latin1').decode(bytes.subarray(start, pos));
    pos++;
    return line;
  };
  const first = readLine();
  if (first === null || !first.startsWith('#?')) {
    if (bytes.length < 2 || bytes[0] !== 0x23 || bytes[1] !== 0x3f) throw badMagic(file, 'a Radiance HDR file');
    throw truncated(file, 'inside the header');
  }
  const programType = first.trim();
  if (programType !== '#?RADIANCE' && programType !== '#?RGBE') {
    throw unsupported(file, `program type "${programType}" (expected #?RADIANCE or #?RGBE)`);
  }
  let exposure = 1;
  let format: string | null = null;
  const variables: Record<string, string> = {};
  for (;;) {
    if (pos > MAX_HEADER_BYTES) throw corrupt(file, `header longer than ${MAX_HEADER_BYTES} bytes`);
    const line = readLine();
    if (line === null) throw truncated(file, 'inside the header');
    if (line.length === 0) break;
    if (line.startsWith('#')) continue;
    const eq = line.indexOf('=');
    if (eq < 0) continue; // command lines of the generating programs
    const key = line.slice(0, eq).trim();
    const value = line.slice(eq + 1).trim();
    if (key === 'FORMAT') {
      format = value;
    } else if (key === 'EXPOSURE') {
      const k = Number(value);
      if (!Number.isFinite(k) || k <= 0) throw corrupt(file, `invalid EXPOSURE "${value}"`);
      exposure *= k; // cumulative (Radiance File Formats)
    } else {
      variables[key] = value;
    }
  }
  if (format !== null && format !== '32-bit_rle_rgbe') {
    throw unsupported(file, `FORMAT=${format} (only 32-bit_rle_rgbe is read)`);
  }
  const resLine = readLine();
  if (resLine === null) throw truncated(file, 'in the resolution string');
  const m = RESOLUTION.exec(resLine.trim());
  if (m === null || m[2] === m[5]) throw corrupt(file, `invalid resolution string "${resLine.trim()}"`);
  const n1 = Number(m[3]);
  const n2 = Number(m[6]);
  const width = m[2] === 'Y' ? n2 : n1;
  const height = m[2] === 'Y' ? n1 : n2;
  return { programType, width, height, exposure, resolution: resLine.trim(), dataOffset: pos, variables };
}

/** Options for decodeHdr. */
export interface HdrDecodeOptions {
  readonly file?: string;
  readonly limits?: DecodeLimits;
}

/**
 * Decodes a Radiance file to linear RGB float32, top row first (+Y up in the picture), x left to right,
 * with EXPOSURE divided out.
 */
export function decodeHdr(bytes: Uint8Array, options: HdrDecodeOptions = {}): DecodedImage {
  const file = options.file ?? 'input.hdr';
  const limits = resolveDecodeLimits(options.limits);
  checkByteLength(file, bytes.length, limits);
  const header = readHdrHeader(bytes, file);
  const { width, height } = header;
  checkDimensions(file, width, height, limits);
  const m = RESOLUTION.exec(header.resolution)!;
  // The stored order: the outer (scanline) axis then the inner axis, each with its sign.
  const yMajor = m[2] === 'Y';
  const outerCount = yMajor ? height : width;
  const innerCount = yMajor ? width : height;
  // Minimum bytes: a run-length scanline holds at least 4 header bytes plus 2 bytes per plane packet.
  if (bytes.length - header.dataOffset < outerCount * 4) throw truncated(file, 'in the pixel data');
  const data = allocatePixels(width * height * 3);
  const scan = new Uint8Array(innerCount * 4);
  let pos = header.dataOffset;
  // 2^(e - 136) / exposure for every exponent byte (e = 0 is black).
  const scale = new Float64Array(256);
  for (let e = 1; e < 256; e++) scale[e] = Math.pow(2, e - 136) / header.exposure;
  // Where each scanline goes: its first pixel's float offset and the step between its pixels.
  // "-Y" means rows stored top first, "+X" left first; for "+X W +Y H" and friends the scanlines are
  // columns, and "-Y" inner runs top to bottom.
  const outerForward = m[1] === (yMajor ? '-' : '+');
  const innerForward = m[4] === (yMajor ? '+' : '-');
  const innerStep = yMajor ? 3 : 3 * width;
  for (let outer = 0; outer < outerCount; outer++) {
    pos = readScanline(bytes, pos, scan, innerCount, file, outer);
    const o0 = outerForward ? outer : outerCount - 1 - outer;
    const first = yMajor ? o0 * width * 3 : o0 * 3;
    let o = innerForward ? first : first + (innerCount - 1) * innerStep;
    const step = innerForward ? innerStep : -innerStep;
    for (let i4 = 0, end = innerCount * 4; i4 < end; i4 += 4, o += step) {
      const f = scale[scan[i4 + 3]!]!;
      data[o] = scan[i4]! * f;
      data[o + 1] = scan[i4 + 1]! * f;
      data[o + 2] = scan[i4 + 2]! * f;
    }
  }
  return decodedImage(width, height, 3, data, 'hdr');
}

/** Reads one scanline of `count` RGBE pixels into scan; returns the new position. */
function readScanline(bytes: Uint8Array, start: number, scan: Uint8Array, count: number, file: string, line: number): number {
  let pos = start;
  const n = bytes.length;
  if (pos + 4 > n) throw truncated(file, `at scanline ${line}`);
  const isRle = count >= 8 && count <= 32767 && bytes[pos] === 2 && bytes[pos + 1] === 2 && (bytes[pos + 2]! & 0x80) === 0;
  if (isRle) {
    const declared = (bytes[pos + 2]! << 8) | bytes[pos + 3]!;
    if (declared !== count) throw corrupt(file, `scanline ${line} declares width ${declared}, expected ${count}`);
    pos += 4;
    for (let plane = 0; plane < 4; plane++) {
      let x = 0;
      while (x < count) {
        if (pos >= n) throw truncated(file, `at scanline ${line}`);
        let c = bytes[pos++]!;
        if (c > 128) {
          c -= 128;
          if (x + c > count) throw corrupt(file, `run-length run past the end of scanline ${line}`);
          if (pos >= n) throw truncated(file, `at scanline ${line}`);
          const v = bytes[pos++]!;
          for (let k = 0; k < c; k++) scan[(x++) * 4 + plane] = v;
        } else {
          if (c === 0) throw corrupt(file, `zero-length packet in scanline ${line}`);
          if (x + c > count) throw corrupt(file, `literal packet past the end of scanline ${line}`);
          if (pos + c > n) throw truncated(file, `at scanline ${line}`);
          for (let k = 0; k < c; k++) scan[(x++) * 4 + plane] = bytes[pos++]!;
        }
      }
    }
    return pos;
  }
  // Flat pixels, with the old run-length form (1, 1, 1, n) repeating the previous pixel.
  let x = 0;
  let shift = 0;
  while (x < count) {
    if (pos + 4 > n) throw truncated(file, `at scanline ${line}`);
    const r = bytes[pos]!;
    const g = bytes[pos + 1]!;
    const b = bytes[pos + 2]!;
    const e = bytes[pos + 3]!;
    pos += 4;
    if (r === 1 && g === 1 && b === 1) {
      if (x === 0) throw corrupt(file, `old-style run at the start of scanline ${line}`);
      const repeat = e * Math.pow(2, shift);
      if (x + repeat > count) throw corrupt(file, `run-length run past the end of scanline ${line}`);
      for (let k = 0; k < repeat; k++, x++) scan.copyWithin(x * 4, (x - 1) * 4, x * 4);
      shift += 8;
    } else {
      scan[x * 4] = r; scan[x * 4 + 1] = g; scan[x * 4 + 2] = b; scan[x * 4 + 3] = e;
      x++;
      shift = 0;
    }
  }
  return pos;
}

/**
 * RGBE bytes of one linear colour, rounded to nearest (README, Conventions): with E = e + 128 where 2^(e-1) <= max < 2^e,
 * channel = round(c / 2^(e - 8)); a max that rounds to 256 moves to the next exponent. Writes out[o..o+3].
 */
export function encodeRgbePixel(out: Uint8Array, o: number, r: number, g: number, b: number): void {
  const rr = r > 0 ? r : 0;
  const gg = g > 0 ? g : 0;
  const bb = b > 0 ? b : 0;
  const d = Math.max(rr, gg, bb);
  if (!(d > 1e-32) || !Number.isFinite(d)) {
    if (d === Infinity) {
      out[o] = rr === Infinity ? 255 : 0; out[o + 1] = gg === Infinity ? 255 : 0; out[o + 2] = bb === Infinity ? 255 : 0; out[o + 3] = 255;
      return;
    }
    out[o] = 0; out[o + 1] = 0; out[o + 2] = 0; out[o + 3] = 0;
    return;
  }
  let e = floorLog2(d) + 1; // d = m 2^e with m in [0.5, 1) (frexp)
  let scale = Math.pow(2, 8 - e);
  if (Math.round(d * scale) >= 256) {
    e += 1;
    scale *= 0.5;
  }
  if (e + 128 > 255) {
    out[o] = 255; out[o + 1] = 255; out[o + 2] = 255; out[o + 3] = 255; // saturate at the largest value
    return;
  }
  if (e + 128 < 1) {
    out[o] = 0; out[o + 1] = 0; out[o + 2] = 0; out[o + 3] = 0;
    return;
  }
  out[o] = Math.round(rr * scale);
  out[o + 1] = Math.round(gg * scale);
  out[o + 2] = Math.round(bb * scale);
  out[o + 3] = e + 128;
}

export interface HdrEncodeOptions {
  readonly file?: string;
  /** Run-length encode scanlines where the width allows it (8..32767). Default true. */
  readonly runLength?: boolean;
  /** Extra header lines written as "KEY=value". */
  readonly variables?: Readonly<Record<string, string>>;
}

/** Encodes an RGB (or RGBA, alpha dropped) float image as a "#?RADIANCE" file, "-Y H +X W". */
export function encodeHdr(image: FloatImage, options: HdrEncodeOptions = {}): Uint8Array {
  const file = options.file ?? 'output.hdr';
  checkImage(file, image, [1, 3, 4]);
  const { width, height, channels, data } = image;
  let header = '#?RADIANCE\nFORMAT=32-bit_rle_rgbe\n';
  for (const [key, value] of Object.entries(options.variables ?? {})) {
    if (/[\n=]/.test(key) || /\n/.test(value)) throw new CodecError('INVALID_ARGUMENT', file, `invalid header variable ${key}`);
    header += `${key}=${value}\n`;
  }
  header += `\n-Y ${height} +X ${width}\n`;
  const head = new TextEncoder().encode(header);
  const rle = (options.runLength ?? true) && width >= 8 && width <= 32767;
  // Worst case for RLE: 4 + 4 planes * (width + ceil(width / 128)) bytes per scanline.
  const maxLine = rle ? 4 + 4 * (width + Math.ceil(width / 128)) : width * 4;
  const out = new Uint8Array(head.length + maxLine * height);
  out.set(head, 0);
  let pos = head.length;
  const scan = new Uint8Array(width * 4);
  const plane = new Uint8Array(width);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * channels;
      const r = data[i]!;
      const g = channels === 1 ? r : data[i + 1]!;
      const b = channels === 1 ? r : data[i + 2]!;
      encodeRgbePixel(scan, x * 4, r, g, b);
    }
    if (!rle) {
      out.set(scan, pos);
      pos += scan.length;
      continue;
    }
    out[pos++] = 2; out[pos++] = 2; out[pos++] = width >> 8; out[pos++] = width & 255;
    for (let p = 0; p < 4; p++) {
      for (let x = 0; x < width; x++) plane[x] = scan[x * 4 + p]!;
      pos = encodeRlePlane(plane, out, pos);
    }
  }
  return out.slice(0, pos);
}

/** New-style RLE of one plane: runs of 4..127 equal bytes, literal packets of up to 128 bytes. */
function encodeRlePlane(plane: Uint8Array, out: Uint8Array, start: number): number {
  const n = plane.length;
  let pos = start;
  let x = 0;
  while (x < n) {
    // Find the next run of at least 4.
    let runStart = x;
    let runLen = 0;
    while (runStart < n) {
      runLen = 1;
      while (runStart + runLen < n && runLen < 127 && plane[runStart + runLen] === plane[runStart]) runLen++;
      if (runLen >= 4) break;
      runStart += runLen;
    }
    if (runLen < 4) runStart = n;
    // Literals up to the run.
    while (x < runStart) {
      const count = Math.min(128, runStart - x);
      out[pos++] = count;
      for (let k = 0; k < count; k++) out[pos++] = plane[x + k]!;
      x += count;
    }
    if (runStart < n) {
      out[pos++] = 128 + runLen;
      out[pos++] = plane[runStart]!;
      x = runStart + runLen;
    }
  }
  return pos;
}
