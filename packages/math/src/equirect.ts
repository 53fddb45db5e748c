/**
 * Equirectangular (latitude-longitude) geometry (README, Conventions): u = 0.5 + atan2(x, -z) / (2 pi),
 * v = acos(y) / pi, row 0 at the top (+Y), the image centre looking towards -Z, u = 0.75 towards +X.
 */

import { PI, TWO_PI } from './constants.js';

/** (u, v) in [0, 1] of a unit direction; written to out[o], out[o + 1]. */
export function directionToEquirect(out: Float64Array, o: number, x: number, y: number, z: number): void {
  out[o] = 0.5 + Math.atan2(x, -z) / TWO_PI;
  out[o + 1] = Math.acos(Math.max(-1, Math.min(1, y))) / PI;
}

/** Unit direction of (u, v); written to out[o..o+2]. Inverse of directionToEquirect. */
export function equirectToDirection(out: Float64Array, o: number, u: number, v: number): void {
  const phi = (u - 0.5) * TWO_PI;
  const theta = v * PI;
  const sinTheta = Math.sin(theta);
  out[o] = Math.sin(phi) * sinTheta;
  out[o + 1] = Math.cos(theta);
  out[o + 2] = -Math.cos(phi) * sinTheta;
}

/**
 * Exact solid angle (steradians) of any pixel in row `row` of a width x height image:
 * (2 pi / W) (cos theta0 - cos theta1), theta0 = pi row / H, theta1 = pi (row + 1) / H (sphere zone area).
 */
export function equirectPixelSolidAngle(width: number, height: number, row: number): number {
  const theta0 = (PI * row) / height;
  const theta1 = (PI * (row + 1)) / height;
  return (TWO_PI / width) * (Math.cos(theta0) - Math.cos(theta1));
}
