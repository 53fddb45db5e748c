/**
 * Packed GPU number formats as pure numeric functions: IEEE 754 binary16, the shared-exponent
 * E5B9G9R9 and the packed unsigned B10G11R11 (Khronos Data Format Specification 1.3, sec. 10.3 and 10.4;
 * Vulkan formats E5B9G9R9_UFLOAT_PACK32 and B10G11R11_UFLOAT_PACK32). All rounding is to nearest, ties to even,
 * directly from the double input (no double rounding through float32).
 */

const f64 = new Float64Array(1);
const u32 = new Uint32Array(f64.buffer);
// Little-endian hosts (every platform Node runs on): the high word is u32[1].
const HIGH = 1;

/** floor(log2(x)) for a finite x > 0, exactly, from the binary64 exponent field. */
export function floorLog2(x: number): number {
  f64[0] = x;
  const biased = (u32[HIGH]! >>> 20) & 0x7ff;
  if (biased === 0) {
    // binary64 subnormal: scale up by 2^64 and retry.
    f64[0] = x * 18446744073709551616;
    return ((u32[HIGH]! >>> 20) & 0x7ff) - 1023 - 64;
  }
  return biased - 1023;
}

function roundHalfEven(m: number): number {
  const r = Math.floor(m);
  const d = m - r;
  if (d > 0.5) return r + 1;
  if (d < 0.5) return r;
  return r % 2 === 0 ? r : r + 1;
}

/**
 * Bits of a non-negative finite value in a small float with a 5-bit exponent (bias 15) and `mantissaBits`
 * bits of mantissa, rounded to nearest even. Returns the exponent-and-mantissa field; a result whose
 * exponent field reaches 31 means overflow and is left to the caller.
 */
function smallFloatBits(x: number, mantissaBits: number): number {
  if (x === 0) return 0;
  const one = 1 << mantissaBits;
  const e = floorLog2(x);
  if (e < -14) {
    // Subnormal: value = m * 2^(-14 - mantissaBits); m = 2^mantissaBits rolls into the smallest normal.
    return roundHalfEven(x * Math.pow(2, 14 + mantissaBits));
  }
  const m = roundHalfEven(x * Math.pow(2, mantissaBits - e)); // in [2^mb, 2^(mb+1)]
  return ((e + 15) << mantissaBits) + (m - one);
}

const f32 = new Float32Array(1);
const f32bits = new Uint32Array(f32.buffer);

/**
 * binary16 bits of a value that is exactly a binary32 number, from its bit pattern (round to nearest
 * even on the 13 dropped mantissa bits; IEEE 754-2008 sec. 4.3.1).
 */
function binary32BitsToBinary16(x: number): number {
  const sign = (x >>> 16) & 0x8000;
  const exp = (x >>> 23) & 0xff;
  let mant = x & 0x7fffff;
  if (exp === 0xff) return sign | (mant !== 0 ? 0x7e00 : 0x7c00);
  const e = exp - 112; // rebias 127 -> 15
  if (e >= 31) return sign | 0x7c00;
  if (e <= 0) {
    if (e < -10) return sign; // below half the smallest subnormal
    mant |= 0x800000;
    const shift = 14 - e;
    let half = mant >>> shift;
    const rem = mant & ((1 << shift) - 1);
    const halfway = 1 << (shift - 1);
    if (rem > halfway || (rem === halfway && (half & 1) === 1)) half++;
    return sign | half;
  }
  let half = (e << 10) | (mant >>> 13);
  const rem = mant & 0x1fff;
  if (rem > 0x1000 || (rem === 0x1000 && (half & 1) === 1)) half++; // a carry may reach Inf (0x7C00), correctly
  return sign | half;
}

/** IEEE 754 binary16 bits of a number, round to nearest even; overflow to +-Inf, NaN to 0x7E00. */
export function float32ToBinary16(value: number): number {
  f32[0] = value;
  if (f32[0] === value) return binary32BitsToBinary16(f32bits[0]!); // exact binary32 values (texels): bit path
  if (Number.isNaN(value)) return 0x7e00;
  const sign = value < 0 || Object.is(value, -0) ? 0x8000 : 0;
  const a = Math.abs(value);
  if (a === Infinity) return sign | 0x7c00;
  const bits = smallFloatBits(a, 10);
  return bits >= 0x7c00 ? sign | 0x7c00 : sign | bits;
}

let halfTable: Float32Array | null = null;

/** The number an IEEE 754 binary16 bit pattern holds (table lookup after the first call). */
export function binary16ToFloat32(bits: number): number {
  if (halfTable === null) {
    halfTable = new Float32Array(65536);
    for (let h = 0; h < 65536; h++) halfTable[h] = binary16ToNumber(h);
  }
  return halfTable[bits & 0xffff]!;
}

function binary16ToNumber(bits: number): number {
  const sign = bits & 0x8000 ? -1 : 1;
  const e = (bits >>> 10) & 0x1f;
  const m = bits & 0x3ff;
  if (e === 0) return sign * m * 5.960464477539063e-8; // 2^-24
  if (e === 31) return m === 0 ? sign * Infinity : NaN;
  return sign * (1 + m / 1024) * Math.pow(2, e - 15);
}

/** Largest value of E5B9G9R9: (511 / 512) * 2^16 = 65408 (Khronos DF spec sec. 10.4). */
export const RGB9E5_MAX = 65408;

/**
 * Encodes linear RGB as E5B9G9R9_UFLOAT_PACK32 (R bits 0-8, G 9-17, B 18-26, E 27-31), following the
 * encoding of EXT_texture_shared_exponent / the Khronos DF spec: clamp to [0, 65408], shared exponent from
 * the largest channel, mantissas rounded to nearest. Negative and NaN channels become 0.
 */
export function encodeRgb9e5(r: number, g: number, b: number): number {
  const rc = r > 0 ? (r < RGB9E5_MAX ? r : RGB9E5_MAX) : 0;
  const gc = g > 0 ? (g < RGB9E5_MAX ? g : RGB9E5_MAX) : 0;
  const bc = b > 0 ? (b < RGB9E5_MAX ? b : RGB9E5_MAX) : 0;
  const maxc = Math.max(rc, gc, bc);
  let expShared = maxc > 0 ? Math.max(-16, floorLog2(maxc)) + 16 : 0;
  let scale = Math.pow(2, expShared - 24);
  if (Math.floor(maxc / scale + 0.5) === 512) {
    expShared += 1;
    scale *= 2;
  }
  const rm = Math.floor(rc / scale + 0.5);
  const gm = Math.floor(gc / scale + 0.5);
  const bm = Math.floor(bc / scale + 0.5);
  return ((expShared << 27) | (bm << 18) | (gm << 9) | rm) >>> 0;
}

/** Decodes E5B9G9R9: channel = mantissa * 2^(E - 24); writes r, g, b to out[o..o+2]. */
export function decodeRgb9e5(out: Float32Array | Float64Array, o: number, packed: number): void {
  const scale = Math.pow(2, (packed >>> 27) - 24);
  out[o] = (packed & 0x1ff) * scale;
  out[o + 1] = ((packed >>> 9) & 0x1ff) * scale;
  out[o + 2] = ((packed >>> 18) & 0x1ff) * scale;
}

/** Largest finite values of the 11-bit (R, G) and 10-bit (B) unsigned floats. */
export const UFLOAT11_MAX = 65024;
export const UFLOAT10_MAX = 64512;

function unsignedSmallFloat(x: number, mantissaBits: number): number {
  if (!(x > 0)) return 0; // negatives, -0 and NaN
  const maxBits = (30 << mantissaBits) | ((1 << mantissaBits) - 1);
  if (x === Infinity) return 31 << mantissaBits;
  const bits = smallFloatBits(x, mantissaBits);
  return bits > maxBits ? maxBits : bits;
}

/**
 * Encodes linear RGB as B10G11R11_UFLOAT_PACK32 (R bits 0-10, G 11-21, B 22-31; Khronos DF spec sec. 10.3):
 * 5-bit exponent (bias 15), 6/6/5-bit mantissas, round to nearest even. Negatives and NaN become 0,
 * finite overflow clamps to the largest finite value, +Inf stays Inf.
 */
export function encodeB10g11r11(r: number, g: number, b: number): number {
  return ((unsignedSmallFloat(b, 5) << 22) | (unsignedSmallFloat(g, 6) << 11) | unsignedSmallFloat(r, 6)) >>> 0;
}

function decodeUnsignedSmallFloat(bits: number, mantissaBits: number): number {
  const e = bits >>> mantissaBits;
  const m = bits & ((1 << mantissaBits) - 1);
  const one = 1 << mantissaBits;
  if (e === 0) return (m / one) * 6.103515625e-5; // 2^-14
  if (e === 31) return m === 0 ? Infinity : NaN;
  return (1 + m / one) * Math.pow(2, e - 15);
}

/** Decodes B10G11R11_UFLOAT_PACK32; writes r, g, b to out[o..o+2]. */
export function decodeB10g11r11(out: Float32Array | Float64Array, o: number, packed: number): void {
  out[o] = decodeUnsignedSmallFloat(packed & 0x7ff, 6);
  out[o + 1] = decodeUnsignedSmallFloat((packed >>> 11) & 0x7ff, 6);
  out[o + 2] = decodeUnsignedSmallFloat((packed >>> 22) & 0x3ff, 5);
}
