/** Fresnel reflectance approximations. */

/**
 * Schlick's approximation F = F0 + (f90 - F0) (1 - cos)^5 (Schlick 1994, "An Inexpensive BRDF Model for
 * Physically-based Rendering", CGF 13(3)). `cosTheta` is v.h for a microfacet BRDF.
 */
export function schlickFresnel(f0: number, f90: number, cosTheta: number): number {
  const m = Math.min(1, Math.max(0, 1 - cosTheta));
  const m2 = m * m;
  return f0 + (f90 - f0) * m2 * m2 * m;
}

/** Normal-incidence reflectance of a dielectric, ((n - 1) / (n + 1))^2 (Fresnel equations at theta = 0). */
export function f0FromIor(ior: number): number {
  const r = (ior - 1) / (ior + 1);
  return r * r;
}

/**
 * Hemispherical-cosine average of Schlick's Fresnel with f90 = 1: 2 * integral F(mu) mu dmu = F0 + (1 - F0) / 21
 * (algebra: 2 * integral (1 - mu)^5 mu dmu = 1/21).
 */
export function schlickFresnelAverage(f0: number): number {
  return f0 + (1 - f0) / 21;
}
