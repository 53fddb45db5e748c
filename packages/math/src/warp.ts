/** Warps of the unit square onto the hemisphere (local frame: z is the normal). */

import { INV_PI, PI } from './constants.js';

/**
 * Cosine-weighted hemisphere sample by Malley's method over Shirley & Chiu's concentric disk map
 * (Shirley & Chiu 1997, "A Low Distortion Map Between Disk and Square", JGT 2(3)).
 * Writes the direction to out[o..o+2]; pdf = cosThetaI / pi.
 */
export function sampleCosineHemisphere(out: Float64Array, o: number, u1: number, u2: number): void {
  const sx = 2 * u1 - 1;
  const sy = 2 * u2 - 1;
  let r = 0;
  let phi = 0;
  if (sx !== 0 || sy !== 0) {
    if (Math.abs(sx) > Math.abs(sy)) {
      r = sx;
      phi = (PI / 4) * (sy / sx);
    } else {
      r = sy;
      phi = PI / 2 - (PI / 4) * (sx / sy);
    }
  }
  const dx = r * Math.cos(phi);
  const dy = r * Math.sin(phi);
  out[o] = dx;
  out[o + 1] = dy;
  out[o + 2] = Math.sqrt(Math.max(0, 1 - dx * dx - dy * dy));
}

/** Density of sampleCosineHemisphere over solid angle: cos(theta) / pi (zero below the horizon). */
export function cosineHemispherePdf(cosThetaI: number): number {
  return cosThetaI > 0 ? cosThetaI * INV_PI : 0;
}

/**
 * Inverse of sampleCosineHemisphere: the (u1, u2) that map to the unit direction (x, y, z >= 0),
 * written to out[o], out[o + 1]. Inverts the concentric map (Shirley & Chiu 1997).
 */
export function invertCosineHemisphereSample(out: Float64Array, o: number, x: number, y: number): void {
  const r = Math.sqrt(x * x + y * y);
  let phi = Math.atan2(y, x);
  if (phi < -PI / 4) phi += 2 * PI; // concentric map angles lie in [-pi/4, 7pi/4)
  let sx: number;
  let sy: number;
  if (phi < PI / 4) {
    sx = r;
    sy = (phi * 4 / PI) * r;
  } else if (phi < (3 * PI) / 4) {
    sy = r;
    sx = (2 - (phi * 4) / PI) * r;
  } else if (phi < (5 * PI) / 4) {
    sx = -r;
    sy = (4 - (phi * 4) / PI) * r;
  } else {
    sy = -r;
    sx = ((phi * 4) / PI - 6) * r;
  }
  out[o] = (sx + 1) / 2;
  out[o + 1] = (sy + 1) / 2;
}

/** Uniform hemisphere sample (z = u1); pdf = 1 / (2 pi). Writes the direction to out[o..o+2]. */
export function sampleUniformHemisphere(out: Float64Array, o: number, u1: number, u2: number): void {
  const z = u1;
  const r = Math.sqrt(Math.max(0, 1 - z * z));
  const phi = 2 * PI * u2;
  out[o] = r * Math.cos(phi);
  out[o + 1] = r * Math.sin(phi);
  out[o + 2] = z;
}

/** Density of sampleUniformHemisphere over solid angle. */
export function uniformHemispherePdf(): number {
  return 1 / (2 * PI);
}
