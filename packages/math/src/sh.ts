/**
 * Real spherical harmonics up to band 2 (SH9) in the order and signs of the README's Conventions (no Condon-Shortley
 * phase), evaluated on (x, y, z) as written. Coefficient arrays are RGB-interleaved: coeffs[3 k + c].
 */

import { PI } from './constants.js';

// Ramamoorthi & Hanrahan 2001, "An Efficient Representation for Irradiance Environment Maps", SIGGRAPH, eq. 3.
export const SH_Y00: number = 0.5 / Math.sqrt(PI); // 1 / (2 sqrt(pi))
export const SH_Y1: number = Math.sqrt(3 / (4 * PI));
export const SH_Y2_OFF: number = Math.sqrt(15 / (4 * PI)); // xy, yz, xz
export const SH_Y20: number = Math.sqrt(5 / (16 * PI)); // (3 z^2 - 1)
export const SH_Y22: number = Math.sqrt(15 / (16 * PI)); // (x^2 - y^2)

/** Lambert (clamped cosine) band weights A_l (Ramamoorthi & Hanrahan 2001, eq. 8): pi, 2pi/3, pi/4. */
export const SH_LAMBERT_BAND: Float64Array = new Float64Array([PI, (2 * PI) / 3, PI / 4]);
/** Band l of each of the nine coefficients. */
export const SH9_BAND_OF: Uint8Array = new Uint8Array([0, 1, 1, 1, 2, 2, 2, 2, 2]);
export const SH9_COUNT = 9;

/** The nine basis values Y_lm(x, y, z) in the README's order, written to out[o..o+8]. */
export function evalSh9Basis(out: Float64Array, o: number, x: number, y: number, z: number): void {
  out[o] = SH_Y00;
  out[o + 1] = SH_Y1 * y;
  out[o + 2] = SH_Y1 * z;
  out[o + 3] = SH_Y1 * x;
  out[o + 4] = SH_Y2_OFF * x * y;
  out[o + 5] = SH_Y2_OFF * y * z;
  out[o + 6] = SH_Y20 * (3 * z * z - 1);
  out[o + 7] = SH_Y2_OFF * x * z;
  out[o + 8] = SH_Y22 * (x * x - y * y);
}

/**
 * Adds one radiance sample to a projection: coeffs[3k + c] += weight * colour_c * Y_k(d).
 * `weight` is the sample's solid angle (steradians) for a quadrature over texels.
 */
export function accumulateSh9(coeffs: Float64Array, x: number, y: number, z: number, r: number, g: number, b: number, weight: number): void {
  const wr = weight * r;
  const wg = weight * g;
  const wb = weight * b;
  let k = SH_Y00;
  coeffs[0] = coeffs[0]! + k * wr; coeffs[1] = coeffs[1]! + k * wg; coeffs[2] = coeffs[2]! + k * wb;
  k = SH_Y1 * y;
  coeffs[3] = coeffs[3]! + k * wr; coeffs[4] = coeffs[4]! + k * wg; coeffs[5] = coeffs[5]! + k * wb;
  k = SH_Y1 * z;
  coeffs[6] = coeffs[6]! + k * wr; coeffs[7] = coeffs[7]! + k * wg; coeffs[8] = coeffs[8]! + k * wb;
  k = SH_Y1 * x;
  coeffs[9] = coeffs[9]! + k * wr; coeffs[10] = coeffs[10]! + k * wg; coeffs[11] = coeffs[11]! + k * wb;
  k = SH_Y2_OFF * x * y;
  coeffs[12] = coeffs[12]! + k * wr; coeffs[13] = coeffs[13]! + k * wg; coeffs[14] = coeffs[14]! + k * wb;
  k = SH_Y2_OFF * y * z;
  coeffs[15] = coeffs[15]! + k * wr; coeffs[16] = coeffs[16]! + k * wg; coeffs[17] = coeffs[17]! + k * wb;
  k = SH_Y20 * (3 * z * z - 1);
  coeffs[18] = coeffs[18]! + k * wr; coeffs[19] = coeffs[19]! + k * wg; coeffs[20] = coeffs[20]! + k * wb;
  k = SH_Y2_OFF * x * z;
  coeffs[21] = coeffs[21]! + k * wr; coeffs[22] = coeffs[22]! + k * wg; coeffs[23] = coeffs[23]! + k * wb;
  k = SH_Y22 * (x * x - y * y);
  coeffs[24] = coeffs[24]! + k * wr; coeffs[25] = coeffs[25]! + k * wg; coeffs[26] = coeffs[26]! + k * wb;
}

/**
 * Irradiance coefficients from radiance coefficients: out = A_l * L_lm (Ramamoorthi & Hanrahan 2001),
 * so that E(n) = sum out_lm Y_lm(n). `out` and `radiance` may be the same array.
 */
export function convolveSh9Lambert(out: Float64Array, radiance: Float64Array): void {
  for (let k = 0; k < 9; k++) {
    const a = SH_LAMBERT_BAND[SH9_BAND_OF[k]!]!;
    for (let c = 0; c < 3; c++) out[3 * k + c] = a * radiance[3 * k + c]!;
  }
}

/** Evaluates an RGB SH9 expansion at a unit direction; writes r, g, b to out[o..o+2]. */
export function evalSh9Rgb(out: Float64Array, o: number, coeffs: Float64Array, x: number, y: number, z: number): void {
  const y0 = SH_Y00;
  const y1 = SH_Y1 * y;
  const y2 = SH_Y1 * z;
  const y3 = SH_Y1 * x;
  const y4 = SH_Y2_OFF * x * y;
  const y5 = SH_Y2_OFF * y * z;
  const y6 = SH_Y20 * (3 * z * z - 1);
  const y7 = SH_Y2_OFF * x * z;
  const y8 = SH_Y22 * (x * x - y * y);
  for (let c = 0; c < 3; c++) {
    out[o + c] = coeffs[c]! * y0 + coeffs[3 + c]! * y1 + coeffs[6 + c]! * y2 + coeffs[9 + c]! * y3 + coeffs[12 + c]! * y4
      + coeffs[15 + c]! * y5 + coeffs[18 + c]! * y6 + coeffs[21 + c]! * y7 + coeffs[24 + c]! * y8;
  }
}

export type Sh9WindowKind = 'none' | 'hann' | 'lanczos';

/**
 * Per-band ringing window weights w_0..w_2 written to out[0..2] (Sloan 2008, "Stupid Spherical Harmonics
 * (SH) Tricks", GDC; from memory). `width` is the band at which the window reaches zero (> 2 keeps all bands):
 * hann w_l = (1 + cos(pi l / width)) / 2; lanczos w_l = sinc(l / width) = sin(pi l / width) / (pi l / width).
 */
export function sh9WindowWeights(out: Float64Array, kind: Sh9WindowKind, width: number): void {
  for (let l = 0; l < 3; l++) {
    let w = 1;
    if (kind === 'hann') {
      w = l >= width ? 0 : 0.5 * (1 + Math.cos((PI * l) / width));
    } else if (kind === 'lanczos' && l > 0) {
      const x = (PI * l) / width;
      w = l >= width ? 0 : Math.sin(x) / x;
    }
    out[l] = w;
  }
}

/** Multiplies each coefficient by its band's weight (weights[0..2]); in place. */
export function applySh9BandWeights(coeffs: Float64Array, weights: Float64Array): void {
  for (let k = 0; k < 9; k++) {
    const w = weights[SH9_BAND_OF[k]!]!;
    for (let c = 0; c < 3; c++) coeffs[3 * k + c] = coeffs[3 * k + c]! * w;
  }
}
