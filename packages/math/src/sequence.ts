/** Low-discrepancy sequences: van der Corput radical inverse, Hammersley points, per-level rotations. */

import { TWO_POW_NEG_32 } from './constants.js';

/** Reverses the 32 bits of an unsigned integer (Warren, "Hacker's Delight", 2nd ed. 2012, sec. 7-1). */
export function reverseBits32(value: number): number {
  let x = value >>> 0;
  x = ((x << 16) | (x >>> 16)) >>> 0;
  x = (((x & 0x00ff00ff) << 8) | ((x >>> 8) & 0x00ff00ff)) >>> 0;
  x = (((x & 0x0f0f0f0f) << 4) | ((x >>> 4) & 0x0f0f0f0f)) >>> 0;
  x = (((x & 0x33333333) << 2) | ((x >>> 2) & 0x33333333)) >>> 0;
  x = (((x & 0x55555555) << 1) | ((x >>> 1) & 0x55555555)) >>> 0;
  return x;
}

/**
 * Van der Corput radical inverse in base 2: the bits of `index` mirrored about the binary point.
 * Returns a double in [0, 1); exact (every value is a multiple of 2^-32).
 */
export function radicalInverseBase2(index: number): number {
  return reverseBits32(index) * TWO_POW_NEG_32;
}

/**
 * Point `index` of the N-point Hammersley set (Hammersley & Handscomb 1964, "Monte Carlo Methods"):
 * (index / count, radicalInverseBase2(index)). Writes u1 to out[o] and u2 to out[o + 1].
 */
export function hammersleyPoint(out: Float64Array, o: number, index: number, count: number): void {
  out[o] = index / count;
  out[o + 1] = radicalInverseBase2(index);
}

/**
 * A deterministic 32-bit integer hash (the "lowbias32" finaliser, Wellons 2018, "Prospecting for Hash
 * Functions"; common practice). Used to derive per-level rotations from a small seed.
 */
export function hashUint32(value: number): number {
  let x = value >>> 0;
  x ^= x >>> 16;
  x = Math.imul(x, 0x7feb352d) >>> 0;
  x ^= x >>> 15;
  x = Math.imul(x, 0x846ca68b) >>> 0;
  x ^= x >>> 16;
  return x >>> 0;
}

/**
 * Cranley-Patterson rotation offsets for one level (Cranley & Patterson 1976, "Randomization of Number
 * Theoretic Methods for Multiple Integration", SIAM J. Numer. Anal. 13(6)). A rotated point is
 * (u + offset) mod 1 per dimension; the offsets depend only on `seed`, so a bake stays deterministic.
 * Writes the two offsets to out[o], out[o + 1]; seed 0 gives (0, 0), meaning no rotation.
 */
export function rotationOffsetsForSeed(out: Float64Array, o: number, seed: number): void {
  if (seed === 0) {
    out[o] = 0;
    out[o + 1] = 0;
    return;
  }
  const h1 = hashUint32(seed);
  const h2 = hashUint32(h1 ^ 0x9e3779b9);
  out[o] = h1 * TWO_POW_NEG_32;
  out[o + 1] = h2 * TWO_POW_NEG_32;
}

/** (u + offset) mod 1, kept in [0, 1). */
export function rotateUnit(u: number, offset: number): number {
  const s = u + offset;
  return s >= 1 ? s - 1 : s;
}
