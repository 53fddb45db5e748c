/**
 * Cube-map geometry (README, Conventions): faces +X, -X, +Y, -Y, +Z, -Z; s, t in [0, 1] from the OpenGL 4.6 core /
 * Vulkan "Cube Map Texture Selection" table; faceU = 2s - 1, faceV = 2t - 1; row 0 of a face is t = 0.
 */

export const FACE_POS_X = 0;
export const FACE_NEG_X = 1;
export const FACE_POS_Y = 2;
export const FACE_NEG_Y = 3;
export const FACE_POS_Z = 4;
export const FACE_NEG_Z = 5;
export const CUBE_FACE_NAMES: readonly string[] = ['+X', '-X', '+Y', '-Y', '+Z', '-Z'];

/**
 * Per-face affine map from (faceU, faceV) to an unnormalised direction: d = C + faceU * U + faceV * V,
 * nine numbers a face (C, U, V), the inverse of the selection table (Vulkan spec, "Cube Map Face Selection").
 */
export const CUBE_FACE_BASIS: Float64Array = new Float64Array([
  // +X: (1, -v, -u)
  1, 0, 0, 0, 0, -1, 0, -1, 0,
  // -X: (-1, -v, u)
  -1, 0, 0, 0, 0, 1, 0, -1, 0,
  // +Y: (u, 1, v)
  0, 1, 0, 1, 0, 0, 0, 0, 1,
  // -Y: (u, -1, -v)
  0, -1, 0, 1, 0, 0, 0, 0, -1,
  // +Z: (u, -v, 1)
  0, 0, 1, 1, 0, 0, 0, -1, 0,
  // -Z: (-u, -v, -1)
  0, 0, -1, -1, 0, 0, 0, -1, 0,
]);

/** Unnormalised direction through (faceU, faceV) in [-1, 1]^2 of a face; written to out[o..o+2]. */
export function cubeFaceToDirection(out: Float64Array, o: number, faceIndex: number, faceU: number, faceV: number): void {
  const b = faceIndex * 9;
  const B = CUBE_FACE_BASIS;
  out[o] = B[b]! + faceU * B[b + 3]! + faceV * B[b + 6]!;
  out[o + 1] = B[b + 1]! + faceU * B[b + 4]! + faceV * B[b + 7]!;
  out[o + 2] = B[b + 2]! + faceU * B[b + 5]! + faceV * B[b + 8]!;
}

/** Unit direction through the centre of texel (texelX, texelY) of a face of size N; written to out[o..o+2]. */
export function cubeTexelCenterDirection(out: Float64Array, o: number, faceIndex: number, texelX: number, texelY: number, faceSize: number): void {
  const faceU = (2 * (texelX + 0.5)) / faceSize - 1;
  const faceV = (2 * (texelY + 0.5)) / faceSize - 1;
  cubeFaceToDirection(out, o, faceIndex, faceU, faceV);
  const inv = 1 / Math.sqrt(out[o]! * out[o]! + out[o + 1]! * out[o + 1]! + out[o + 2]! * out[o + 2]!);
  out[o] = out[o]! * inv;
  out[o + 1] = out[o + 1]! * inv;
  out[o + 2] = out[o + 2]! * inv;
}

/**
 * Face selection (Vulkan spec, "Cube Map Face Selection and Transformations"): for a non-zero direction
 * writes faceIndex to out[o], s to out[o + 1] and t to out[o + 2], s and t in [0, 1].
 * Ties between major axes go to z, then y, then x, as the Vulkan spec recommends.
 */
export function directionToCubeFace(out: Float64Array, o: number, x: number, y: number, z: number): void {
  const ax = Math.abs(x);
  const ay = Math.abs(y);
  const az = Math.abs(z);
  let face: number;
  let sc: number;
  let tc: number;
  let ma: number;
  if (az >= ay && az >= ax) {
    ma = az;
    if (z >= 0) {
      face = FACE_POS_Z; sc = x; tc = -y;
    } else {
      face = FACE_NEG_Z; sc = -x; tc = -y;
    }
  } else if (ay >= ax) {
    ma = ay;
    if (y >= 0) {
      face = FACE_POS_Y; sc = x; tc = z;
    } else {
      face = FACE_NEG_Y; sc = x; tc = -z;
    }
  } else {
    ma = ax;
    if (x >= 0) {
      face = FACE_POS_X; sc = -z; tc = -y;
    } else {
      face = FACE_NEG_X; sc = z; tc = -y;
    }
  }
  out[o] = face;
  out[o + 1] = 0.5 * (sc / ma + 1);
  out[o + 2] = 0.5 * (tc / ma + 1);
}

/**
 * Antiderivative of the face's solid-angle element 1 / (1 + u^2 + v^2)^(3/2) du dv on the unit-distance
 * plane: F(u, v) = atan2(u v, sqrt(u^2 + v^2 + 1)) (derivation ours).
 */
export function cubeAreaElementIntegral(faceU: number, faceV: number): number {
  return Math.atan2(faceU * faceV, Math.sqrt(faceU * faceU + faceV * faceV + 1));
}

/** Exact solid angle (steradians) of the rectangle [u0, u1] x [v0, v1] on a face. */
export function cubeRectSolidAngle(u0: number, v0: number, u1: number, v1: number): number {
  return cubeAreaElementIntegral(u1, v1) - cubeAreaElementIntegral(u0, v1) - cubeAreaElementIntegral(u1, v0) + cubeAreaElementIntegral(u0, v0);
}

/** Exact solid angle (steradians) of texel (texelX, texelY) on a face of size N; the same on every face. */
export function cubeTexelSolidAngle(texelX: number, texelY: number, faceSize: number): number {
  const inv = 2 / faceSize;
  return cubeRectSolidAngle(texelX * inv - 1, texelY * inv - 1, (texelX + 1) * inv - 1, (texelY + 1) * inv - 1);
}

/** Solid angles of every texel of one face (row-major, N*N entries); all six faces share the table. */
export function cubeFaceSolidAngleTable(faceSize: number): Float64Array {
  const table = new Float64Array(faceSize * faceSize);
  for (let y = 0; y < faceSize; y++) {
    for (let x = 0; x < faceSize; x++) table[y * faceSize + x] = cubeTexelSolidAngle(x, y, faceSize);
  }
  return table;
}
