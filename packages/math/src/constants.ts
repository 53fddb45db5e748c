/** Numeric constants and the luminance weights shared by every package. */

export const PI: number = Math.PI;
export const TWO_PI: number = 2 * Math.PI;
export const FOUR_PI: number = 4 * Math.PI;
export const INV_PI: number = 1 / Math.PI;
export const INV_TWO_PI: number = 1 / (2 * Math.PI);
export const INV_FOUR_PI: number = 1 / (4 * Math.PI);

/** 2^-32: maps a 32-bit unsigned integer onto [0, 1). */
export const TWO_POW_NEG_32: number = 2.3283064365386963e-10;

// ITU-R BT.709-6, Item 3.2 (derivation of luminance signal): Y = 0.2126 R + 0.7152 G + 0.0722 B.
export const LUMINANCE_R: number = 0.2126;
export const LUMINANCE_G: number = 0.7152;
export const LUMINANCE_B: number = 0.0722;

/** Relative luminance of a linear BT.709 colour. */
export function luminance(r: number, g: number, b: number): number {
  return LUMINANCE_R * r + LUMINANCE_G * g + LUMINANCE_B * b;
}
