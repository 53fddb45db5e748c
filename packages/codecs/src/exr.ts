/**
 * OpenEXR single-part scanline files ("OpenEXR File Layout", ASWF): compression NONE, ZIPS and ZIP
 * (zlib via fflate with the byte-interleave and delta predictor), HALF / FLOAT / UINT channels, any line
 * order. Tiled, deep, multi-part files and other compressions are refused by name.
 */

import { binary16ToFloat32, float32ToBinary16 } from '@lightkiln/math';
import { zlibSync } from 'fflate';
import { inflateBounded } from './zlib.js';
import { badMagic, CodecError, corrupt, invalidArgument, truncated, unsupported } from './errors.js';
import { allocatePixels, checkByteLength, checkDecodeMemory, checkDimensions, checkImage, decodedImage, resolveDecodeLimits, type DecodedImage, type DecodeLimits, type FloatImage } from './image.js';

export const EXR_MAGIC = 20000630;
const COMPRESSION_NAMES = ['NONE', 'RLE', 'ZIPS', 'ZIP', 'PIZ', 'PXR24', 'B44', 'B44A', 'DWAA', 'DWAB', 'HTJ2K'];
const LINES_PER_BLOCK: Record<number, number> = { 0: 1, 2: 1, 3: 16 };
const PIXEL_TYPE_BYTES = [4, 2, 4]; // UINT, HALF, FLOAT

export type ExrCompression = 'none' | 'zips' | 'zip';
export type ExrPixelType = 'half' | 'float';

export interface ExrChannel {
  readonly name: string;
  /** 0 UINT, 1 HALF, 2 FLOAT. */
  readonly pixelType: number;
  readonly xSampling: number;
  readonly ySampling: number;
}

export interface ExrHeader {
  readonly channels: readonly ExrChannel[];
  readonly compression: number;
  readonly dataWindow: readonly [number, number, number, number];
  readonly lineOrder: number;
  readonly attributes: ReadonlyMap<string, { type: string; size: number }>;
  /** Offset of the line offset table. */
  readonly headerEnd: number;
}

class Reader {
  pos = 0;
  readonly view: DataView;
  constructor(readonly bytes: Uint8Array, readonly file: string) {
    this.view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  }
  need(n: number, what: string): void {
    if (this.pos + n > this.bytes.length) throw truncated(this.file, what);
  }
  i32(what: string): number {
    this.need(4, what);
    const v = this.view.getInt32(this.pos, true);
    this.pos += 4;
    return v;
  }
  cstring(what: string, max: number): string {
    const start = this.pos;
    while (this.pos < this.bytes.length && this.bytes[this.pos] !== 0) {
      if (this.pos - start >= max) throw corrupt(this.file, `${what} longer than ${max} bytes`);
      this.pos++;
    }
    if (this.pos >= this.bytes.length) throw truncated(this.file, what);
    const s = new TextDecoder('latin1').decode(this.bytes.subarray(start, this.pos));
    this.pos++;
    return s;
  }
}

/** Reads and validates the header of a scanline file; throws CodecError naming any unsupported feature. */
export function readExrHeader(bytes: Uint8Array, file = 'input.exr'): ExrHeader {
  const r = new Reader(bytes, file);
  if (bytes.length < 8) {
    if (bytes.length >= 4 && new DataView(bytes.buffer, bytes.byteOffset).getInt32(0, true) !== EXR_MAGIC) throw badMagic(file, 'an OpenEXR file');
    throw truncated(file, 'in the magic number and version');
  }
  if (r.i32('magic') !== EXR_MAGIC) throw badMagic(file, 'an OpenEXR file');
  const version = r.i32('version');
  if ((version & 0xff) !== 2) throw unsupported(file, `OpenEXR version ${version & 0xff}`);
  if (version & 0x200) throw unsupported(file, 'tiled OpenEXR images');
  if (version & 0x800) throw unsupported(file, 'deep OpenEXR data');
  if (version & 0x1000) throw unsupported(file, 'multi-part OpenEXR files');
  const maxName = version & 0x400 ? 255 : 31;
  const attributes = new Map<string, { type: string; size: number }>();
  let channels: ExrChannel[] | null = null;
  let compression = -1;
  let dataWindow: [number, number, number, number] | null = null;
  let lineOrder = 0;
  for (;;) {
    r.need(1, 'in the header');
    if (bytes[r.pos] === 0) {
      r.pos++;
      break;
    }
    const name = r.cstring('attribute name', maxName);
    const type = r.cstring('attribute type', maxName);
    const size = r.i32('attribute size');
    if (size < 0) throw corrupt(file, `attribute ${name} has negative size`);
    r.need(size, `in attribute ${name}`);
    const start = r.pos;
    attributes.set(name, { type, size });
    if (name === 'channels' && type === 'chlist') {
      channels = [];
      const end = start + size;
      while (r.pos < end && bytes[r.pos] !== 0) {
        const cname = r.cstring('channel name', maxName);
        const pixelType = r.i32('channel type');
        r.pos += 4; // pLinear + reserved
        const xSampling = r.i32('channel sampling');
        const ySampling = r.i32('channel sampling');
        if (pixelType < 0 || pixelType > 2) throw corrupt(file, `channel ${cname} has unknown pixel type ${pixelType}`);
        if (xSampling !== 1 || ySampling !== 1) throw unsupported(file, `subsampled channel ${cname} (${xSampling} x ${ySampling})`);
        channels.push({ name: cname, pixelType, xSampling, ySampling });
      }
      if (r.pos > end) throw corrupt(file, 'channel list overruns its attribute');
    } else if (name === 'compression') {
      if (size < 1) throw corrupt(file, 'empty compression attribute');
      compression = bytes[start]!;
    } else if (name === 'dataWindow') {
      if (size < 16) throw corrupt(file, 'short dataWindow attribute');
      const v = new DataView(bytes.buffer, bytes.byteOffset + start, 16);
      dataWindow = [v.getInt32(0, true), v.getInt32(4, true), v.getInt32(8, true), v.getInt32(12, true)];
    } else if (name === 'lineOrder') {
      if (size < 1) throw corrupt(file, 'empty lineOrder attribute');
      lineOrder = bytes[start]!;
    } else if (name === 'tiles') {
      throw unsupported(file, 'tiled OpenEXR images');
    }
    r.pos = start + size;
  }
  if (channels === null) throw corrupt(file, 'missing the required channels attribute');
  if (dataWindow === null) throw corrupt(file, 'missing the required dataWindow attribute');
  if (compression < 0) throw corrupt(file, 'missing the required compression attribute');
  if (!(compression in LINES_PER_BLOCK)) {
    throw unsupported(file, `${COMPRESSION_NAMES[compression] ?? `unknown (${compression})`} compression (NONE, ZIPS and ZIP are read)`);
  }
  return { channels, compression, dataWindow, lineOrder, attributes, headerEnd: r.pos };
}

export interface ExrDecodeOptions {
  readonly file?: string;
  readonly limits?: DecodeLimits;
}

/**
 * Decodes R, G, B (and A) by name to float32 (Y alone decodes as grey); the data window becomes the image,
 * top row (yMin) first.
 */
export function decodeExr(bytes: Uint8Array, options: ExrDecodeOptions = {}): DecodedImage {
  const file = options.file ?? 'input.exr';
  const limits = resolveDecodeLimits(options.limits);
  checkByteLength(file, bytes.length, limits);
  const header = readExrHeader(bytes, file);
  const [xMin, yMin, xMax, yMax] = header.dataWindow;
  const width = xMax - xMin + 1;
  const height = yMax - yMin + 1;
  checkDimensions(file, width, height, limits);
  const names = header.channels.map((c) => c.name);
  const pick = (n: string): number => names.indexOf(n);
  let targets: number[];
  if (pick('R') >= 0 || pick('G') >= 0 || pick('B') >= 0) targets = [pick('R'), pick('G'), pick('B')];
  else if (pick('Y') >= 0) targets = [pick('Y')];
  else throw unsupported(file, `no R, G, B or Y channel (channels: ${names.join(', ') || 'none'})`);
  if (pick('A') >= 0 && targets.length === 3) targets.push(pick('A'));
  const outChannels = targets.length;
  const linesPerBlock = LINES_PER_BLOCK[header.compression]!;
  const blockCount = Math.ceil(height / linesPerBlock);
  // Per-line byte layout: channels in file order, each `width` samples.
  const channelOffsets: number[] = [];
  let lineBytes = 0;
  for (const c of header.channels) {
    channelOffsets.push(lineBytes);
    lineBytes += PIXEL_TYPE_BYTES[c.pixelType]! * width;
  }
  checkDecodeMemory(file, width * height * outChannels * 4 + 2 * linesPerBlock * lineBytes, limits, `${header.channels.length} channels of ${width} x ${height}: float32 pixels and one chunk of ${linesPerBlock} lines`);
  const tableEnd = header.headerEnd + blockCount * 8;
  if (tableEnd > bytes.length) throw truncated(file, 'in the line offset table');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const data = allocatePixels(width * height * outChannels);
  if (outChannels === 4 && pick('A') < 0) data.fill(1);
  const seen = new Uint8Array(blockCount);
  for (let b = 0; b < blockCount; b++) {
    const offset = Number(view.getBigUint64(header.headerEnd + b * 8, true));
    if (offset < tableEnd || offset + 8 > bytes.length) throw corrupt(file, `line offset table entry ${b} points outside the file (${offset})`);
    const y = view.getInt32(offset, true);
    const size = view.getInt32(offset + 4, true);
    if ((y - yMin) % linesPerBlock !== 0 || y < yMin || y > yMax) throw corrupt(file, `chunk ${b} has invalid y ${y}`);
    const block = (y - yMin) / linesPerBlock;
    if (seen[block]) throw corrupt(file, `chunk for y ${y} appears twice`);
    seen[block] = 1;
    if (size < 0 || offset + 8 + size > bytes.length) throw truncated(file, `in the chunk at y ${y}`);
    const lines = Math.min(linesPerBlock, yMax - y + 1);
    const rawSize = lines * lineBytes;
    const packed = bytes.subarray(offset + 8, offset + 8 + size);
    let raw: Uint8Array;
    if (header.compression === 0 || size === rawSize) {
      if (size !== rawSize) throw corrupt(file, `chunk at y ${y} holds ${size} bytes, expected ${rawSize}`);
      raw = packed;
    } else {
      raw = inflateZipBlock(packed, rawSize, file, y);
    }
    const rawView = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
    for (let l = 0; l < lines; l++) {
      const row = y - yMin + l;
      for (let t = 0; t < outChannels; t++) {
        const ci = targets[t]!;
        if (ci < 0) continue;
        const type = header.channels[ci]!.pixelType;
        const base = l * lineBytes + channelOffsets[ci]!;
        let o = row * width * outChannels + t;
        if (type === 1) {
          for (let x = 0; x < width; x++, o += outChannels) data[o] = binary16ToFloat32(rawView.getUint16(base + x * 2, true));
        } else if (type === 2) {
          for (let x = 0; x < width; x++, o += outChannels) data[o] = rawView.getFloat32(base + x * 4, true);
        } else {
          for (let x = 0; x < width; x++, o += outChannels) data[o] = rawView.getUint32(base + x * 4, true);
        }
      }
    }
  }
  const missing = seen.indexOf(0);
  if (missing >= 0) throw corrupt(file, `no chunk for y ${yMin + missing * linesPerBlock}`);
  return decodedImage(width, height, outChannels, data, 'exr');
}

/**
 * Inflates a ZIP/ZIPS chunk into exactly `rawSize` bytes (stopping one byte past it), then undoes the predictor and the even/odd byte split (OpenEXR File Layout, ZIP compression).
 */
function inflateZipBlock(packed: Uint8Array, rawSize: number, file: string, y: number): Uint8Array {
  const t = inflateBounded(packed, rawSize, file, `the chunk at y ${y}`);
  for (let i = 1; i < rawSize; i++) t[i] = (t[i - 1]! + t[i]! - 128) & 0xff;
  const out = new Uint8Array(rawSize);
  const half = (rawSize + 1) >> 1;
  for (let i = 0; i < rawSize; i++) out[i] = i & 1 ? t[half + (i >> 1)]! : t[i >> 1]!;
  return out;
}

/** Byte split and predictor then zlib: the inverse of inflateZipBlock. */
function deflateZipBlock(raw: Uint8Array): Uint8Array {
  const n = raw.length;
  const t = new Uint8Array(n);
  const half = (n + 1) >> 1;
  for (let i = 0; i < n; i++) {
    if (i & 1) t[half + (i >> 1)] = raw[i]!;
    else t[i >> 1] = raw[i]!;
  }
  for (let i = n - 1; i > 0; i--) t[i] = (t[i]! - t[i - 1]! + 128) & 0xff;
  return zlibSync(t, { level: 6 });
}

export interface ExrEncodeOptions {
  readonly file?: string;
  readonly pixelType?: ExrPixelType;
  readonly compression?: ExrCompression;
}

/** Encodes a grey (Y), RGB or RGBA float image as a single-part scanline file, increasing y. */
export function encodeExr(image: FloatImage, options: ExrEncodeOptions = {}): Uint8Array {
  const file = options.file ?? 'output.exr';
  checkImage(file, image, [1, 3, 4]);
  const pixelType = options.pixelType ?? 'half';
  const compressionName = options.compression ?? 'zip';
  const compression = compressionName === 'none' ? 0 : compressionName === 'zips' ? 2 : compressionName === 'zip' ? 3 : -1;
  if (compression < 0) throw invalidArgument(file, `unknown EXR compression "${String(compressionName)}"`);
  if (pixelType !== 'half' && pixelType !== 'float') throw invalidArgument(file, `unknown EXR pixel type "${String(pixelType)}"`);
  const { width, height, channels, data } = image;
  // Channels sorted by name, as the format requires; src index into the interleaved pixel.
  const layout = channels === 1 ? [['Y', 0]] : channels === 3 ? [['B', 2], ['G', 1], ['R', 0]] : [['A', 3], ['B', 2], ['G', 1], ['R', 0]];
  const typeCode = pixelType === 'half' ? 1 : 2;
  const sampleBytes = pixelType === 'half' ? 2 : 4;
  const enc = new TextEncoder();
  const parts: Uint8Array[] = [];
  const attr = (name: string, type: string, value: Uint8Array): void => {
    const head = enc.encode(`${name}\0${type}\0`);
    const size = new Uint8Array(4);
    new DataView(size.buffer).setInt32(0, value.length, true);
    parts.push(head, size, value);
  };
  const chl: number[] = [];
  for (const [name] of layout) {
    chl.push(...enc.encode(`${name as string}\0`));
    const b = new Uint8Array(16);
    const v = new DataView(b.buffer);
    v.setInt32(0, typeCode, true);
    v.setInt32(8, 1, true);
    v.setInt32(12, 1, true);
    chl.push(...b);
  }
  chl.push(0);
  const box = (x0: number, y0: number, x1: number, y1: number): Uint8Array => {
    const b = new Uint8Array(16);
    const v = new DataView(b.buffer);
    v.setInt32(0, x0, true); v.setInt32(4, y0, true); v.setInt32(8, x1, true); v.setInt32(12, y1, true);
    return b;
  };
  const f32 = (...values: number[]): Uint8Array => {
    const b = new Uint8Array(values.length * 4);
    const v = new DataView(b.buffer);
    values.forEach((x, i) => v.setFloat32(i * 4, x, true));
    return b;
  };
  attr('channels', 'chlist', Uint8Array.from(chl));
  attr('compression', 'compression', Uint8Array.of(compression));
  attr('dataWindow', 'box2i', box(0, 0, width - 1, height - 1));
  attr('displayWindow', 'box2i', box(0, 0, width - 1, height - 1));
  attr('lineOrder', 'lineOrder', Uint8Array.of(0));
  attr('pixelAspectRatio', 'float', f32(1));
  attr('screenWindowCenter', 'v2f', f32(0, 0));
  attr('screenWindowWidth', 'float', f32(1));
  parts.push(Uint8Array.of(0));
  const linesPerBlock = LINES_PER_BLOCK[compression]!;
  const blockCount = Math.ceil(height / linesPerBlock);
  const lineBytes = layout.length * width * sampleBytes;
  const chunks: Uint8Array[] = [];
  for (let b = 0; b < blockCount; b++) {
    const y0 = b * linesPerBlock;
    const lines = Math.min(linesPerBlock, height - y0);
    const raw = new Uint8Array(lines * lineBytes);
    const v = new DataView(raw.buffer);
    for (let l = 0; l < lines; l++) {
      const row = y0 + l;
      layout.forEach(([, src], ci) => {
        const base = l * lineBytes + ci * width * sampleBytes;
        for (let x = 0; x < width; x++) {
          const value = data[(row * width + x) * channels + (src as number)]!;
          if (sampleBytes === 2) v.setUint16(base + x * 2, float32ToBinary16(value), true);
          else v.setFloat32(base + x * 4, value, true);
        }
      });
    }
    let payload: Uint8Array = raw;
    if (compression !== 0) {
      const packed = deflateZipBlock(raw);
      if (packed.length < raw.length) payload = packed; // stored raw when not smaller (size == raw)
    }
    const chunk = new Uint8Array(8 + payload.length);
    const cv = new DataView(chunk.buffer);
    cv.setInt32(0, y0, true);
    cv.setInt32(4, payload.length, true);
    chunk.set(payload, 8);
    chunks.push(chunk);
  }
  const headerBytes = parts.reduce((n, p) => n + p.length, 8);
  const table = new Uint8Array(blockCount * 8);
  const tv = new DataView(table.buffer);
  let offset = headerBytes + table.length;
  chunks.forEach((c, i) => {
    tv.setBigUint64(i * 8, BigInt(offset), true);
    offset += c.length;
  });
  const out = new Uint8Array(offset);
  const ov = new DataView(out.buffer);
  ov.setInt32(0, EXR_MAGIC, true);
  ov.setInt32(4, 2, true);
  let pos = 8;
  for (const p of parts) { out.set(p, pos); pos += p.length; }
  out.set(table, pos); pos += table.length;
  for (const c of chunks) { out.set(c, pos); pos += c.length; }
  if (pos !== out.length) throw new CodecError('CORRUPT', file, 'internal size mismatch while writing');
  return out;
}
