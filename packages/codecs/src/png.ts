/**
 * PNG 8-bit RGB/RGBA writer (W3C PNG / ISO/IEC 15948) with per-row filter choice, zlib via fflate, and
 * the preview helpers: exposure plus a tone curve to sRGB, and RGBM / RGBD packing for 8-bit HDR transport.
 */

import { zlibSync } from 'fflate';
import { CodecError, invalidArgument } from './errors.js';
import { checkImage, type FloatImage } from './image.js';

const CRC_TABLE = ((): Uint32Array => {
  const table = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    table[n] = c >>> 0;
  }
  return table;
})();

/** CRC-32 (ISO 3309 / ITU-T V.42, reflected polynomial 0xEDB88320) as PNG uses it. */
export function crc32(bytes: Uint8Array, seed = 0): number {
  let c = (seed ^ 0xffffffff) >>> 0;
  for (let i = 0; i < bytes.length; i++) c = CRC_TABLE[(c ^ bytes[i]!) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

export interface Rgba8Image {
  readonly width: number;
  readonly height: number;
  /** 3 or 4. */
  readonly channels: number;
  readonly data: Uint8Array;
}

export type PngFilterChoice = 'none' | 'sub' | 'up' | 'average' | 'paeth' | 'adaptive';

export interface PngEncodeOptions {
  readonly file?: string;
  /** Filter per row; 'adaptive' (default) picks the filter with the smallest sum of absolute residuals. */
  readonly filter?: PngFilterChoice;
  /** tEXt chunks (Latin-1 keyword -> text), e.g. { 'lightkiln:rgbm-range': '8' }. */
  readonly text?: Readonly<Record<string, string>>;
  /** zlib level 0..9; default 6. */
  readonly level?: number;
}

function paeth(a: number, b: number, c: number): number {
  const p = a + b - c;
  const pa = Math.abs(p - a);
  const pb = Math.abs(p - b);
  const pc = Math.abs(p - c);
  if (pa <= pb && pa <= pc) return a;
  return pb <= pc ? b : c;
}

/** Writes filter type `f` of row `cur` (previous row `prev`, bpp bytes per pixel) into out at o + 1. */
function filterRow(f: number, cur: Uint8Array, prev: Uint8Array | null, bpp: number, out: Uint8Array, o: number): number {
  out[o] = f;
  let cost = 0;
  for (let i = 0; i < cur.length; i++) {
    const x = cur[i]!;
    const a = i >= bpp ? cur[i - bpp]! : 0;
    const b = prev ? prev[i]! : 0;
    const c = prev && i >= bpp ? prev[i - bpp]! : 0;
    let v: number;
    if (f === 0) v = x;
    else if (f === 1) v = x - a;
    else if (f === 2) v = x - b;
    else if (f === 3) v = x - ((a + b) >> 1);
    else v = x - paeth(a, b, c);
    v &= 0xff;
    out[o + 1 + i] = v;
    cost += v < 128 ? v : 256 - v;
  }
  return cost;
}

function chunk(type: string, data: Uint8Array): Uint8Array {
  const out = new Uint8Array(12 + data.length);
  const view = new DataView(out.buffer);
  view.setUint32(0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  view.setUint32(8 + data.length, crc32(out.subarray(4, 8 + data.length)));
  return out;
}

/** Encodes 8-bit RGB or RGBA pixels as a PNG file. */
export function encodePng(image: Rgba8Image, options: PngEncodeOptions = {}): Uint8Array {
  const file = options.file ?? 'output.png';
  const { width, height, channels, data } = image;
  if (!Number.isInteger(width) || !Number.isInteger(height) || width <= 0 || height <= 0) throw invalidArgument(file, `invalid image size ${width} x ${height}`);
  if (channels !== 3 && channels !== 4) throw invalidArgument(file, `PNG writer takes 3 or 4 channels, got ${channels}`);
  if (data.length !== width * height * channels) throw invalidArgument(file, `pixel array holds ${data.length} bytes, expected ${width * height * channels}`);
  const filterNames: PngFilterChoice[] = ['none', 'sub', 'up', 'average', 'paeth'];
  const choice = options.filter ?? 'adaptive';
  const fixed = filterNames.indexOf(choice);
  if (fixed < 0 && choice !== 'adaptive') throw invalidArgument(file, `unknown PNG filter "${String(choice)}"`);
  const stride = width * channels;
  const raw = new Uint8Array(height * (stride + 1));
  const trial = new Uint8Array(stride + 1);
  for (let y = 0; y < height; y++) {
    const cur = data.subarray(y * stride, (y + 1) * stride);
    const prev = y > 0 ? data.subarray((y - 1) * stride, y * stride) : null;
    const o = y * (stride + 1);
    if (fixed >= 0) {
      filterRow(fixed, cur, prev, channels, raw, o);
      continue;
    }
    let best = filterRow(0, cur, prev, channels, raw, o);
    for (let f = 1; f < 5; f++) {
      const cost = filterRow(f, cur, prev, channels, trial, 0);
      if (cost < best) {
        best = cost;
        raw.set(trial, o);
      }
    }
  }
  const ihdr = new Uint8Array(13);
  const iv = new DataView(ihdr.buffer);
  iv.setUint32(0, width);
  iv.setUint32(4, height);
  ihdr[8] = 8;
  ihdr[9] = channels === 4 ? 6 : 2;
  const parts = [Uint8Array.of(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a), chunk('IHDR', ihdr)];
  for (const [key, value] of Object.entries(options.text ?? {})) {
    if (key.length < 1 || key.length > 79 || /[^\x20-\x7e]/.test(key)) throw new CodecError('INVALID_ARGUMENT', file, `invalid PNG text keyword "${key}"`);
    parts.push(chunk('tEXt', Uint8Array.from([...key, '\0', ...value].map((ch) => ch.charCodeAt(0) & 0xff))));
  }
  const level = options.level ?? 6;
  parts.push(chunk('IDAT', zlibSync(raw, { level: level as 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8 | 9 })), chunk('IEND', new Uint8Array(0)));
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let pos = 0;
  for (const p of parts) { out.set(p, pos); pos += p.length; }
  return out;
}

/** sRGB transfer function (IEC 61966-2-1): 12.92 c below 0.0031308, else 1.055 c^(1/2.4) - 0.055. */
export function linearToSrgb(c: number): number {
  if (!(c > 0)) return 0;
  if (c >= 1) return 1;
  return c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
}

export type ToneCurve = 'clamp' | 'reinhard';

export interface PreviewOptions {
  /** Exposure in stops: pixels are multiplied by 2^exposureEv first. Default 0. */
  readonly exposureEv?: number;
  /**
   * 'reinhard' (default): c / (1 + c) per channel (Reinhard et al. 2002, "Photographic Tone Reproduction
   * for Digital Images", eq. 3), then sRGB; 'clamp': clamp to [0, 1], then sRGB.
   */
  readonly curve?: ToneCurve;
}

/** Maps a linear float image to 8-bit sRGB RGB for viewing (alpha dropped). */
export function toneMapToSrgb8(image: FloatImage, options: PreviewOptions = {}): Rgba8Image {
  checkImage('preview', image, [1, 3, 4]);
  const scale = Math.pow(2, options.exposureEv ?? 0);
  const reinhard = (options.curve ?? 'reinhard') === 'reinhard';
  const { width, height, channels, data } = image;
  const out = new Uint8Array(width * height * 3);
  for (let p = 0; p < width * height; p++) {
    for (let c = 0; c < 3; c++) {
      let v = data[p * channels + (channels === 1 ? 0 : c)]! * scale;
      if (!(v > 0)) v = 0;
      if (reinhard) v = v / (1 + v);
      out[p * 3 + c] = Math.round(linearToSrgb(v) * 255);
    }
  }
  return { width, height, channels: 3, data: out };
}

/**
 * RGBM packing with range M (common practice): a = ceil(255 clamp(max/M, 1/255, 1)) / 255, rgb' = rgb / (a M),
 * stored as bytes of rgb' and a; decode rgb' a M. Values are linear (no gamma).
 */
export function packRgbm(image: FloatImage, range: number): Rgba8Image {
  checkImage('rgbm', image, [3, 4]);
  if (!(range > 0 && range <= 255)) throw invalidArgument('rgbm', `RGBM range must be in (0, 255], got ${range}`);
  const { width, height, channels, data } = image;
  const out = new Uint8Array(width * height * 4);
  for (let p = 0; p < width * height; p++) {
    const r = Math.max(0, data[p * channels]!);
    const g = Math.max(0, data[p * channels + 1]!);
    const b = Math.max(0, data[p * channels + 2]!);
    const m = Math.min(1, Math.max(1 / 255, Math.max(r, g, b) / range));
    const a = Math.ceil(m * 255) / 255;
    const s = 1 / (a * range);
    out[p * 4] = Math.round(Math.min(1, r * s) * 255);
    out[p * 4 + 1] = Math.round(Math.min(1, g * s) * 255);
    out[p * 4 + 2] = Math.round(Math.min(1, b * s) * 255);
    out[p * 4 + 3] = Math.round(a * 255);
  }
  return { width, height, channels: 4, data: out };
}

export function unpackRgbm(image: Rgba8Image, range: number): FloatImage {
  const { width, height, data } = image;
  const out = new Float32Array(width * height * 3);
  for (let p = 0; p < width * height; p++) {
    const k = (data[p * 4 + 3]! / 255) * range / 255;
    out[p * 3] = data[p * 4]! * k;
    out[p * 3 + 1] = data[p * 4 + 1]! * k;
    out[p * 3 + 2] = data[p * 4 + 2]! * k;
  }
  return { width, height, channels: 3, data: out };
}

/**
 * RGBD packing with range M <= 255 (common practice): d = min(floor(max(M / max, 1)), 255) / 255,
 * store rgb d and d; decode rgb' / d. Values are linear (no gamma); colours above M clip.
 */
export function packRgbd(image: FloatImage, range: number): Rgba8Image {
  checkImage('rgbd', image, [3, 4]);
  if (!(range >= 1 && range <= 255)) throw invalidArgument('rgbd', `RGBD range must be in [1, 255], got ${range}`);
  const { width, height, channels, data } = image;
  const out = new Uint8Array(width * height * 4);
  for (let p = 0; p < width * height; p++) {
    const r = Math.max(0, data[p * channels]!);
    const g = Math.max(0, data[p * channels + 1]!);
    const b = Math.max(0, data[p * channels + 2]!);
    const maxc = Math.max(r, g, b, 1e-30);
    const d = Math.min(Math.floor(Math.max(range / maxc, 1)), 255) / 255;
    out[p * 4] = Math.round(Math.min(1, r * d) * 255);
    out[p * 4 + 1] = Math.round(Math.min(1, g * d) * 255);
    out[p * 4 + 2] = Math.round(Math.min(1, b * d) * 255);
    out[p * 4 + 3] = Math.round(d * 255);
  }
  return { width, height, channels: 4, data: out };
}

export function unpackRgbd(image: Rgba8Image): FloatImage {
  const { width, height, data } = image;
  const out = new Float32Array(width * height * 3);
  for (let p = 0; p < width * height; p++) {
    const d = data[p * 4 + 3]! / 255;
    const k = d > 0 ? 1 / (255 * d) : 0;
    out[p * 3] = data[p * 4]! * k;
    out[p * 3 + 1] = data[p * 4 + 1]! * k;
    out[p * 3 + 2] = data[p * 4 + 2]! * k;
  }
  return { width, height, channels: 3, data: out };
}
