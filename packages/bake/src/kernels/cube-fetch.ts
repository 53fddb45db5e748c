/**
 * Shared inline helpers of the kernels: cube texel layout and bilinear fetches. A cube level of face
 * size n is 6 n^2 RGB float32 texels, face-major, rows top (t = 0) first: ((face n + y) n + x) 3.
 */

/**
 * Bilinear fetch from one face of a cube level at face coordinates (s, t) in [0, 1], clamped to the face
 * edges (no filtering across faces). Adds weight * colour to acc[0..2].
 */
export function fetchFaceBilinear(acc: Float64Array, cube: Float32Array, levelOffset: number, size: number, face: number, s: number, t: number, weight: number): void {
  let fx = s * size - 0.5;
  let fy = t * size - 0.5;
  const max = size - 1;
  if (fx < 0) fx = 0; else if (fx > max) fx = max;
  if (fy < 0) fy = 0; else if (fy > max) fy = max;
  const x0 = fx | 0;
  const y0 = fy | 0;
  const x1 = x0 < max ? x0 + 1 : max;
  const y1 = y0 < max ? y0 + 1 : max;
  const ax = fx - x0;
  const ay = fy - y0;
  const base = levelOffset + face * size * size * 3;
  const i00 = base + (y0 * size + x0) * 3;
  const i10 = base + (y0 * size + x1) * 3;
  const i01 = base + (y1 * size + x0) * 3;
  const i11 = base + (y1 * size + x1) * 3;
  const w00 = (1 - ax) * (1 - ay) * weight;
  const w10 = ax * (1 - ay) * weight;
  const w01 = (1 - ax) * ay * weight;
  const w11 = ax * ay * weight;
  acc[0] = acc[0]! + cube[i00]! * w00 + cube[i10]! * w10 + cube[i01]! * w01 + cube[i11]! * w11;
  acc[1] = acc[1]! + cube[i00 + 1]! * w00 + cube[i10 + 1]! * w10 + cube[i01 + 1]! * w01 + cube[i11 + 1]! * w11;
  acc[2] = acc[2]! + cube[i00 + 2]! * w00 + cube[i10 + 2]! * w10 + cube[i01 + 2]! * w01 + cube[i11 + 2]! * w11;
}
