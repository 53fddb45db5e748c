/**
 * KTX 2.0 container (Khronos KTX 2.0 specification) for 2D textures and cubemaps with mip chains, the
 * float formats lightkiln ships, a Data Format Descriptor per the Khronos Data Format Specification 1.3,
 * key/value metadata (KTXwriter, KTXorientation, our own keys) and optional zlib (scheme 3) or Zstandard
 * (scheme 2) supercompression.
 */

import { binary16ToFloat32, decodeB10g11r11, decodeRgb9e5, encodeB10g11r11, encodeRgb9e5, float32ToBinary16 } from '@lightkiln/math';
import { zlibSync } from 'fflate';
import { inflateBounded } from './zlib.js';
import { zstdCompress, zstdDecompressExactly } from './zstd.js';
import { badMagic, CodecError, corrupt, invalidArgument, truncated, unsupported } from './errors.js';
import { checkByteLength, resolveDecodeLimits, type DecodeLimits } from './image.js';

export const KTX2_IDENTIFIER: Uint8Array = Uint8Array.of(0xab, 0x4b, 0x54, 0x58, 0x20, 0x32, 0x30, 0xbb, 0x0d, 0x0a, 0x1a, 0x0a);

export type Ktx2Format = 'rgba16f' | 'rgba32f' | 'rgb9e5' | 'b10g11r11' | 'rg16f';

interface FormatInfo {
  readonly vkFormat: number;
  readonly vkName: string;
  readonly bytesPerTexel: number;
  readonly typeSize: number;
  /** Channels of the float data the writer takes and the reader returns. */
  readonly channels: number;
  readonly dfdSamples: readonly (readonly [number, number, number])[]; // [word0, lower, upper]
}

const F_S = 0xc0;
const FLOAT_ONE = 0x3f800000;
const FLOAT_MINUS_ONE = 0xbf800000;

// Vulkan format enumerants and DFD samples (Khronos Data Format specification 1.3, sec. 5.6).
const FORMATS: Readonly<Record<Ktx2Format, FormatInfo>> = {
  rgba16f: {
    vkFormat: 97, vkName: 'VK_FORMAT_R16G16B16A16_SFLOAT', bytesPerTexel: 8, typeSize: 2, channels: 4,
    dfdSamples: [0, 1, 2, 15].map((ch, i) => [(i * 16) | (15 << 16) | ((ch | F_S) << 24), FLOAT_MINUS_ONE, FLOAT_ONE] as const),
  },
  rgba32f: {
    vkFormat: 109, vkName: 'VK_FORMAT_R32G32B32A32_SFLOAT', bytesPerTexel: 16, typeSize: 4, channels: 4,
    dfdSamples: [0, 1, 2, 15].map((ch, i) => [(i * 32) | (31 << 16) | ((ch | F_S) << 24), FLOAT_MINUS_ONE, FLOAT_ONE] as const),
  },
  rg16f: {
    vkFormat: 83, vkName: 'VK_FORMAT_R16G16_SFLOAT', bytesPerTexel: 4, typeSize: 2, channels: 2,
    dfdSamples: [0, 1].map((ch, i) => [(i * 16) | (15 << 16) | ((ch | F_S) << 24), FLOAT_MINUS_ONE, FLOAT_ONE] as const),
  },
  b10g11r11: {
    vkFormat: 122, vkName: 'VK_FORMAT_B10G11R11_UFLOAT_PACK32', bytesPerTexel: 4, typeSize: 4, channels: 3,
    dfdSamples: [[0x800a0000, 0, FLOAT_ONE], [0x810a000b, 0, FLOAT_ONE], [0x82090016, 0, FLOAT_ONE]],
  },
  rgb9e5: {
    vkFormat: 123, vkName: 'VK_FORMAT_E5B9G9R9_UFLOAT_PACK32', bytesPerTexel: 4, typeSize: 4, channels: 3,
    dfdSamples: [
      [0x00080000, 0, 8448], [0x2004001b, 15, 31],
      [0x01080009, 0, 8448], [0x2104001b, 15, 31],
      [0x02080012, 0, 8448], [0x2204001b, 15, 31],
    ],
  },
};

const FORMAT_BY_VK = new Map<number, Ktx2Format>(Object.entries(FORMATS).map(([k, v]) => [v.vkFormat, k as Ktx2Format]));

export function ktx2FormatInfo(format: Ktx2Format): { vkFormat: number; vkName: string; bytesPerTexel: number; channels: number } {
  const info = FORMATS[format];
  return { vkFormat: info.vkFormat, vkName: info.vkName, bytesPerTexel: info.bytesPerTexel, channels: info.channels };
}

export function ktx2FormatFromVk(vkFormat: number): Ktx2Format | undefined {
  return FORMAT_BY_VK.get(vkFormat);
}

/** The Data Format Descriptor (including its leading total-size word) for a format. */
export function buildDfd(format: Ktx2Format): Uint32Array {
  const info = FORMATS[format];
  const blockSize = 24 + 16 * info.dfdSamples.length;
  const words = new Uint32Array(1 + blockSize / 4);
  words[0] = 4 + blockSize;
  words[1] = 0; // vendorId 0 (Khronos), descriptorType 0 (basic)
  words[2] = 2 | (blockSize << 16); // versionNumber 2
  words[3] = 1 | (1 << 8) | (1 << 16); // KHR_DF_MODEL_RGBSDA, primaries BT709, transfer LINEAR, straight alpha
  words[4] = 0; // texel block 1x1x1x1
  words[5] = info.bytesPerTexel; // bytesPlane0
  words[6] = 0;
  info.dfdSamples.forEach(([w0, lower, upper], i) => {
    words[7 + i * 4] = w0 >>> 0;
    words[8 + i * 4] = 0;
    words[9 + i * 4] = lower >>> 0;
    words[10 + i * 4] = upper >>> 0;
  });
  return words;
}

/** Packs float texels (info.channels interleaved) into the format's bytes. */
export function packTexels(format: Ktx2Format, data: Float32Array, texelCount: number): Uint8Array {
  const info = FORMATS[format];
  const out = new Uint8Array(texelCount * info.bytesPerTexel);
  const view = new DataView(out.buffer);
  const c = info.channels;
  if (data.length !== texelCount * c) throw invalidArgument('ktx2', `level holds ${data.length} values, expected ${texelCount * c} (${c} channels)`);
  if (format === 'rgba16f' || format === 'rg16f') {
    for (let i = 0; i < texelCount * c; i++) view.setUint16(i * 2, float32ToBinary16(data[i]!), true);
  } else if (format === 'rgba32f') {
    for (let i = 0; i < texelCount * c; i++) view.setFloat32(i * 4, data[i]!, true);
  } else if (format === 'rgb9e5') {
    for (let t = 0; t < texelCount; t++) view.setUint32(t * 4, encodeRgb9e5(data[t * 3]!, data[t * 3 + 1]!, data[t * 3 + 2]!), true);
  } else {
    for (let t = 0; t < texelCount; t++) view.setUint32(t * 4, encodeB10g11r11(data[t * 3]!, data[t * 3 + 1]!, data[t * 3 + 2]!), true);
  }
  return out;
}

/**
 * Packs RGB float texels (3 interleaved, `texelCount` of them) straight into the format's bytes, without
 * a float copy in the format's channel count: alpha 1 for the RGBA formats, and each channel above
 * `max` (the format's largest finite value, per channel) stored as that value. Returns the bytes and the
 * number of texels clamped. Same bytes as packTexels on the clamped RGBA data. With `target` (exactly the
 * level's packed length, e.g. its place in a file being written) the bytes go there.
 */
export function packRgbTexels(format: Ktx2Format, rgb: Float32Array, max: readonly [number, number, number], target?: Uint8Array): { bytes: Uint8Array; clamped: number } {
  const info = FORMATS[format];
  if (info === undefined || info.channels < 3) throw invalidArgument('ktx2', `format "${String(format)}" does not hold RGB texels`);
  const texelCount = rgb.length / 3;
  if (!Number.isInteger(texelCount)) throw invalidArgument('ktx2', `RGB level holds ${rgb.length} values, not a multiple of 3`);
  if (target !== undefined && target.length !== texelCount * info.bytesPerTexel) throw invalidArgument('ktx2', `target holds ${target.length} bytes, the level packs to ${texelCount * info.bytesPerTexel}`);
  const out = target ?? new Uint8Array(texelCount * info.bytesPerTexel);
  const view = new DataView(out.buffer, out.byteOffset, out.byteLength);
  const [mr, mg, mb] = max;
  const one16 = float32ToBinary16(1);
  let clamped = 0;
  for (let t = 0; t < texelCount; t++) {
    let r = rgb[t * 3]!;
    let g = rgb[t * 3 + 1]!;
    let b = rgb[t * 3 + 2]!;
    if (r > mr || g > mg || b > mb) {
      clamped++;
      if (r > mr) r = mr;
      if (g > mg) g = mg;
      if (b > mb) b = mb;
    }
    if (format === 'rgba16f') {
      view.setUint16(t * 8, float32ToBinary16(r), true);
      view.setUint16(t * 8 + 2, float32ToBinary16(g), true);
      view.setUint16(t * 8 + 4, float32ToBinary16(b), true);
      view.setUint16(t * 8 + 6, one16, true);
    } else if (format === 'rgba32f') {
      view.setFloat32(t * 16, r, true);
      view.setFloat32(t * 16 + 4, g, true);
      view.setFloat32(t * 16 + 8, b, true);
      view.setFloat32(t * 16 + 12, 1, true);
    } else if (format === 'rgb9e5') {
      view.setUint32(t * 4, encodeRgb9e5(r, g, b), true);
    } else {
      view.setUint32(t * 4, encodeB10g11r11(r, g, b), true);
    }
  }
  return { bytes: out, clamped };
}

/** Unpacks a level's bytes back to float texels (info.channels interleaved). */
export function unpackTexels(format: Ktx2Format, bytes: Uint8Array): Float32Array {
  const info = FORMATS[format];
  const texels = bytes.length / info.bytesPerTexel;
  const out = new Float32Array(texels * info.channels);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (format === 'rgba16f' || format === 'rg16f') {
    for (let i = 0; i < out.length; i++) out[i] = binary16ToFloat32(view.getUint16(i * 2, true));
  } else if (format === 'rgba32f') {
    for (let i = 0; i < out.length; i++) out[i] = view.getFloat32(i * 4, true);
  } else if (format === 'rgb9e5') {
    for (let t = 0; t < texels; t++) decodeRgb9e5(out, t * 3, view.getUint32(t * 4, true));
  } else {
    for (let t = 0; t < texels; t++) decodeB10g11r11(out, t * 3, view.getUint32(t * 4, true));
  }
  return out;
}

export type Ktx2Supercompression = 'none' | 'zlib' | 'zstd';

/** A level that packs itself: `byteLength` packed bytes, written by pack() into the array it is given. */
export interface Ktx2LevelPacker {
  readonly byteLength: number;
  pack(target: Uint8Array): void;
}

export interface Ktx2EncodeInput {
  readonly format: Ktx2Format;
  /** Size of level 0; cubemaps need width = height. */
  readonly width: number;
  readonly height: number;
  /** 1 (2D) or 6 (cubemap: +X, -X, +Y, -Y, +Z, -Z). */
  readonly faceCount: 1 | 6;
  /**
   * Texels per level, level 0 first; each level is the faces one after another, rows top first. A
   * Float32Array holds `channels` of the format interleaved; a Uint8Array holds texels already packed in
   * the format (packTexels, packRgbTexels); a Ktx2LevelPacker packs itself into the bytes it is given
   * (without supercompression, its place in the file: no second copy of the level). A partial chain is
   * allowed (any count >= 1).
   */
  readonly levels: readonly (Float32Array | Uint8Array | Ktx2LevelPacker)[];
  /** Extra key/values (keys must not start with "KTX"/"ktx"); strings are written NUL-terminated. */
  readonly keyValues?: Readonly<Record<string, string | Uint8Array>>;
  /** KTXwriter value; default "lightkiln"; "" omits the entry (the spec only encourages it). */
  readonly writer?: string;
  readonly supercompression?: Ktx2Supercompression;
  /** zlib level when supercompressed; default 6. */
  readonly zlibLevel?: number;
  /** Zstandard level when supercompressed with 'zstd' (needs initZstd() first); default 3 (see benchmarks/supercompression.bench.ts). */
  readonly zstdLevel?: number;
}

const align = (n: number, a: number): number => Math.ceil(n / a) * a;
const lcm4 = (n: number): number => (n % 4 === 0 ? n : n % 2 === 0 ? n * 2 : n * 4);

/** Writes a KTX 2.0 file. */
export function encodeKtx2(input: Ktx2EncodeInput): Uint8Array {
  const file = 'ktx2';
  const info = FORMATS[input.format];
  if (info === undefined) throw invalidArgument(file, `unknown KTX 2.0 format "${String(input.format)}"`);
  const { width, height, faceCount } = input;
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) throw invalidArgument(file, `invalid size ${width} x ${height}`);
  if (faceCount !== 1 && faceCount !== 6) throw invalidArgument(file, `faceCount must be 1 or 6, got ${String(faceCount)}`);
  if (faceCount === 6 && width !== height) throw invalidArgument(file, `cubemap faces must be square, got ${width} x ${height}`);
  const levelCount = input.levels.length;
  const maxLevels = Math.floor(Math.log2(Math.max(width, height))) + 1;
  if (levelCount < 1 || levelCount > maxLevels) throw invalidArgument(file, `level count ${levelCount} outside 1..${maxLevels}`);
  const sc = input.supercompression ?? 'none';
  if (sc !== 'none' && sc !== 'zlib' && sc !== 'zstd') throw invalidArgument(file, `unknown supercompression "${String(sc)}"`);
  // KTX 2.0 supercompressionScheme: 2 = Zstandard, 3 = zlib (KTX 2.0 specification, section 3.4).
  const scheme = sc === 'zstd' ? 2 : sc === 'zlib' ? 3 : 0;
  // Level payloads (after optional supercompression, one frame or stream per level).
  // Without supercompression a packer writes into the file itself (below); its payload is just a length.
  const payloads: (Uint8Array | Ktx2LevelPacker)[] = [];
  const uncompressed: number[] = [];
  for (let l = 0; l < levelCount; l++) {
    const w = Math.max(1, width >> l);
    const h = Math.max(1, height >> l);
    const level = input.levels[l]!;
    const expected = w * h * faceCount * info.bytesPerTexel;
    // Packed bytes and packers both state their length as byteLength.
    if (!(level instanceof Float32Array) && level.byteLength !== expected) throw invalidArgument(file, `packed level ${l} holds ${level.byteLength} bytes, expected ${expected}`);
    if (scheme === 0 && !(level instanceof Float32Array)) {
      uncompressed.push(expected);
      payloads.push(level);
      continue;
    }
    const raw = level instanceof Uint8Array ? level : level instanceof Float32Array ? packTexels(input.format, level, w * h * faceCount) : packedLevel(level);
    uncompressed.push(raw.length);
    payloads.push(scheme === 3 ? zlibSync(raw, { level: (input.zlibLevel ?? 6) as 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8 | 9 }) : scheme === 2 ? zstdCompress(raw, input.zstdLevel ?? 3, file) : raw);
  }
  // Key/value data, sorted by key code points.
  const enc = new TextEncoder();
  const kv: [string, Uint8Array][] = [];
  kv.push(['KTXorientation', enc.encode('rd\0')]);
  if (input.writer !== '') kv.push(['KTXwriter', enc.encode(`${input.writer ?? 'lightkiln'}\0`)]);
  for (const [key, value] of Object.entries(input.keyValues ?? {})) {
    if (/^ktx/i.test(key)) throw invalidArgument(file, `key "${key}" uses the reserved KTX prefix`);
    if (key.length === 0 || key.includes('\0')) throw invalidArgument(file, `invalid key "${key}"`);
    kv.push([key, typeof value === 'string' ? enc.encode(`${value}\0`) : value]);
  }
  kv.sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  const kvParts: Uint8Array[] = [];
  for (const [key, value] of kv) {
    const k = enc.encode(key);
    const length = k.length + 1 + value.length;
    const entry = new Uint8Array(align(4 + length, 4));
    new DataView(entry.buffer).setUint32(0, length, true);
    entry.set(k, 4);
    entry.set(value, 4 + k.length + 1);
    kvParts.push(entry);
  }
  const kvdLength = kvParts.reduce((n, p) => n + p.length, 0);
  const dfd = buildDfd(input.format);
  const dfdOffset = 80 + 24 * levelCount;
  const kvdOffset = dfdOffset + dfd.byteLength;
  let pos = kvdOffset + kvdLength;
  // Level data smallest first; each level aligned to lcm(texel block size, 4) unless supercompressed.
  const levelAlign = scheme === 0 ? lcm4(info.bytesPerTexel) : 1;
  const offsets = new Array<number>(levelCount);
  for (let l = levelCount - 1; l >= 0; l--) {
    pos = align(pos, levelAlign);
    offsets[l] = pos;
    pos += payloads[l]!.byteLength;
  }
  const out = new Uint8Array(pos);
  const view = new DataView(out.buffer);
  out.set(KTX2_IDENTIFIER, 0);
  const header = [info.vkFormat, info.typeSize, width, faceCount === 6 ? height : height, 0, 0, faceCount, levelCount, scheme];
  header.forEach((v, i) => view.setUint32(12 + i * 4, v, true));
  view.setUint32(48, dfdOffset, true);
  view.setUint32(52, dfd.byteLength, true);
  view.setUint32(56, kvdLength > 0 ? kvdOffset : 0, true);
  view.setUint32(60, kvdLength, true);
  view.setBigUint64(64, 0n, true);
  view.setBigUint64(72, 0n, true);
  for (let l = 0; l < levelCount; l++) {
    view.setBigUint64(80 + l * 24, BigInt(offsets[l]!), true);
    view.setBigUint64(88 + l * 24, BigInt(payloads[l]!.byteLength), true);
    view.setBigUint64(96 + l * 24, BigInt(uncompressed[l]!), true);
  }
  for (let i = 0; i < dfd.length; i++) view.setUint32(dfdOffset + i * 4, dfd[i]!, true);
  let kp = kvdOffset;
  for (const p of kvParts) { out.set(p, kp); kp += p.length; }
  for (let l = 0; l < levelCount; l++) {
    const payload = payloads[l]!;
    if (payload instanceof Uint8Array) out.set(payload, offsets[l]!);
    else payload.pack(out.subarray(offsets[l]!, offsets[l]! + payload.byteLength));
  }
  return out;
}

function packedLevel(packer: Ktx2LevelPacker): Uint8Array {
  const bytes = new Uint8Array(packer.byteLength);
  packer.pack(bytes);
  return bytes;
}

export interface Ktx2Level {
  readonly width: number;
  readonly height: number;
  /** Float texels of all faces, format channels interleaved. */
  readonly data: Float32Array;
  readonly byteOffset: number;
  readonly byteLength: number;
  readonly uncompressedByteLength: number;
}

export interface Ktx2File {
  readonly format: Ktx2Format;
  readonly vkFormat: number;
  readonly vkName: string;
  readonly width: number;
  readonly height: number;
  readonly faceCount: number;
  readonly channels: number;
  readonly supercompression: Ktx2Supercompression;
  readonly levels: readonly Ktx2Level[];
  /** Key/value data; string values with their trailing NUL removed. */
  readonly keyValues: ReadonlyMap<string, string>;
  readonly dfd: Uint32Array;
}

export interface Ktx2DecodeOptions {
  readonly file?: string;
  readonly limits?: DecodeLimits;
}

/** Reads a KTX 2.0 file written in one of our formats (2D or cubemap, none, zlib or Zstandard). */
export function decodeKtx2(bytes: Uint8Array, options: Ktx2DecodeOptions = {}): Ktx2File {
  const file = options.file ?? 'input.ktx2';
  const limits = resolveDecodeLimits(options.limits);
  checkByteLength(file, bytes.length, limits);
  for (let i = 0; i < 12; i++) {
    if (i >= bytes.length) throw bytes.length === 0 || bytes.every((b, k) => b === KTX2_IDENTIFIER[k]) ? truncated(file, 'in the identifier') : badMagic(file, 'a KTX 2.0 file');
    if (bytes[i] !== KTX2_IDENTIFIER[i]) throw badMagic(file, 'a KTX 2.0 file');
  }
  if (bytes.length < 80) throw truncated(file, 'in the header');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const u32 = (o: number): number => view.getUint32(o, true);
  const vkFormat = u32(12);
  const width = u32(20);
  const height0 = u32(24);
  const depth = u32(28);
  const layers = u32(32);
  const faceCount = u32(36);
  const levelCountRaw = u32(40);
  const scheme = u32(44);
  const format = FORMAT_BY_VK.get(vkFormat);
  if (format === undefined) throw unsupported(file, `vkFormat ${vkFormat}`);
  if (depth > 0) throw unsupported(file, '3D textures');
  if (layers > 0) throw unsupported(file, 'texture arrays');
  if (faceCount !== 1 && faceCount !== 6) throw corrupt(file, `faceCount ${faceCount}`);
  if (scheme !== 0 && scheme !== 2 && scheme !== 3) throw unsupported(file, `supercompression scheme ${scheme}`);
  const height = Math.max(1, height0);
  if (width < 1 || width > limits.maxDimension || height > limits.maxDimension) throw new CodecError('LIMIT_EXCEEDED', file, `texture size ${width} x ${height} outside 1..${limits.maxDimension}`);
  if (width * height * faceCount > limits.maxPixels) throw new CodecError('LIMIT_EXCEEDED', file, `texture of ${width * height * faceCount} texels exceeds the limit of ${limits.maxPixels}`);
  const levelCount = Math.max(1, levelCountRaw);
  if (levelCount > 32) throw corrupt(file, `levelCount ${levelCount}`);
  if (bytes.length < 80 + 24 * levelCount) throw truncated(file, 'in the level index');
  const info = FORMATS[format];
  const dfdOffset = u32(48);
  const dfdLength = u32(52);
  if (dfdOffset + dfdLength > bytes.length || dfdLength < 4) throw corrupt(file, 'data format descriptor lies outside the file');
  const dfd = new Uint32Array(dfdLength / 4);
  for (let i = 0; i < dfd.length; i++) dfd[i] = u32(dfdOffset + i * 4);
  const kvdOffset = u32(56);
  const kvdLength = u32(60);
  if (kvdOffset + kvdLength > bytes.length) throw corrupt(file, 'key/value data lies outside the file');
  const keyValues = new Map<string, string>();
  const dec = new TextDecoder();
  for (let p = kvdOffset; p < kvdOffset + kvdLength;) {
    if (p + 4 > kvdOffset + kvdLength) throw corrupt(file, 'truncated key/value entry');
    const length = u32(p);
    if (p + 4 + length > kvdOffset + kvdLength) throw corrupt(file, 'key/value entry overruns the key/value data');
    const entry = bytes.subarray(p + 4, p + 4 + length);
    const nul = entry.indexOf(0);
    if (nul < 0) throw corrupt(file, 'key/value entry without a NUL after the key');
    let value = entry.subarray(nul + 1);
    if (value.length > 0 && value[value.length - 1] === 0) value = value.subarray(0, value.length - 1);
    keyValues.set(dec.decode(entry.subarray(0, nul)), dec.decode(value));
    p += align(4 + length, 4);
  }
  const levels: Ktx2Level[] = [];
  for (let l = 0; l < levelCount; l++) {
    const byteOffset = Number(view.getBigUint64(80 + l * 24, true));
    const byteLength = Number(view.getBigUint64(88 + l * 24, true));
    const uncompressedByteLength = Number(view.getBigUint64(96 + l * 24, true));
    const w = Math.max(1, width >> l);
    const h = Math.max(1, height >> l);
    const expected = w * h * faceCount * info.bytesPerTexel;
    if (uncompressedByteLength !== expected) throw corrupt(file, `level ${l} declares ${uncompressedByteLength} bytes, expected ${expected}`);
    if (byteOffset + byteLength > bytes.length) throw truncated(file, `in level ${l}`);
    let raw = bytes.subarray(byteOffset, byteOffset + byteLength);
    if (scheme === 3) raw = inflateExactly(raw, expected, file, l);
    else if (scheme === 2) raw = zstdDecompressExactly(raw, expected, file, `level ${l}`);
    else if (byteLength !== expected) throw corrupt(file, `level ${l} holds ${byteLength} bytes, expected ${expected}`);
    levels.push({ width: w, height: h, data: unpackTexels(format, raw), byteOffset, byteLength, uncompressedByteLength });
  }
  return {
    format, vkFormat, vkName: info.vkName, width, height, faceCount, channels: info.channels,
    supercompression: scheme === 3 ? 'zlib' : scheme === 2 ? 'zstd' : 'none', levels, keyValues, dfd,
  };
}

function inflateExactly(packed: Uint8Array, size: number, file: string, level: number): Uint8Array {
  return inflateBounded(packed, size, file, `level ${level}`);
}
