/** Orthonormal bases around a unit vector. */

/**
 * Branch-free orthonormal basis (Duff et al. 2017, "Building an Orthonormal Basis, Revisited", JCGT 6(1)).
 * For unit (nx, ny, nz) writes tangent b1 to out[o..o+2] and bitangent b2 to out[o+3..o+5];
 * (b1, b2, n) is right-handed.
 */
export function buildOrthonormalBasis(out: Float64Array, o: number, nx: number, ny: number, nz: number): void {
  const sign = nz >= 0 ? 1 : -1; // copysign(1, nz), with +0 -> +1
  const a = -1 / (sign + nz);
  const b = nx * ny * a;
  out[o] = 1 + sign * nx * nx * a;
  out[o + 1] = sign * b;
  out[o + 2] = -sign * nx;
  out[o + 3] = b;
  out[o + 4] = sign + ny * ny * a;
  out[o + 5] = -ny;
}
