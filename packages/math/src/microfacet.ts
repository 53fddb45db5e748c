/**
 * The GGX (Trowbridge-Reitz) microfacet distribution, its samplers and densities, and Smith masking.
 * Local frame: z is the macro-surface normal n. `alpha` is the GGX width; artists' values are
 * perceptual roughness, converted only by alphaFromPerceptualRoughness.
 */

import { INV_PI, PI } from './constants.js';

/** alpha = perceptualRoughness^2 (Burley 2012, "Physically-Based Shading at Disney", sec. 5.4). */
export function alphaFromPerceptualRoughness(perceptualRoughness: number): number {
  return perceptualRoughness * perceptualRoughness;
}

/**
 * GGX normal distribution D(h) (Walter et al. 2007, "Microfacet Models for Refraction through Rough
 * Surfaces", EGSR): alpha^2 / (pi ((n.h)^2 (alpha^2 - 1) + 1)^2). Zero below the horizon.
 */
export function ggxD(cosThetaH: number, alpha: number): number {
  if (cosThetaH <= 0) return 0;
  const a2 = alpha * alpha;
  const d = cosThetaH * cosThetaH * (a2 - 1) + 1;
  return a2 / (PI * d * d);
}

/**
 * Samples a half vector h with density D(h) (n.h) (Walter et al. 2007):
 * cos^2(theta_h) = (1 - u1) / (1 + (alpha^2 - 1) u1), phi = 2 pi u2. Writes h to out[o..o+2].
 */
export function sampleGgxHalfVector(out: Float64Array, o: number, alpha: number, u1: number, u2: number): void {
  const a2 = alpha * alpha;
  const cos2 = (1 - u1) / (1 + (a2 - 1) * u1);
  const cosTheta = Math.sqrt(cos2);
  const sinTheta = Math.sqrt(Math.max(0, 1 - cos2));
  const phi = 2 * PI * u2;
  out[o] = sinTheta * Math.cos(phi);
  out[o + 1] = sinTheta * Math.sin(phi);
  out[o + 2] = cosTheta;
}

/** Density of sampleGgxHalfVector over the solid angle of h: D(h) (n.h). */
export function ggxHalfVectorPdf(cosThetaH: number, alpha: number): number {
  return ggxD(cosThetaH, alpha) * Math.max(0, cosThetaH);
}

/**
 * Density of the reflected direction l = reflect(-v, h) when h ~ sampleGgxHalfVector:
 * p(l) = D(h) (n.h) / (4 v.h), from the Jacobian d omega_h / d omega_l = 1 / (4 v.h) (Walter et al. 2007).
 * With n = v this is D(h) / 4.
 */
export function ggxReflectedPdf(cosThetaH: number, vDotH: number, alpha: number): number {
  if (vDotH <= 0) return 0;
  return ggxHalfVectorPdf(cosThetaH, alpha) / (4 * vDotH);
}

/**
 * Inverse of sampleGgxHalfVector: the (u1, u2) that give the unit half vector (x, y, z), written to
 * out[o], out[o + 1]. From the CDF in c = cos(theta_h): u1 = (1 - c^2) / (1 + c^2 (alpha^2 - 1)).
 */
export function invertGgxHalfVectorSample(out: Float64Array, o: number, x: number, y: number, z: number, alpha: number): void {
  const a2 = alpha * alpha;
  const c2 = z * z;
  out[o] = (1 - c2) / (1 + c2 * (a2 - 1));
  let phi = Math.atan2(y, x);
  if (phi < 0) phi += 2 * PI;
  out[o + 1] = phi / (2 * PI);
}

/**
 * Smith Lambda for GGX (Heitz 2014, "Understanding the Masking-Shadowing Function in Microfacet-Based
 * BRDFs", JCGT 3(2)): (-1 + sqrt(1 + alpha^2 tan^2 theta)) / 2.
 */
export function smithLambda(cosTheta: number, alpha: number): number {
  const c2 = cosTheta * cosTheta;
  if (c2 <= 0) return Infinity;
  const tan2 = (1 - c2) / c2;
  return (-1 + Math.sqrt(1 + alpha * alpha * tan2)) / 2;
}

/** Smith masking G1 = 1 / (1 + Lambda) (Heitz 2014). */
export function smithG1(cosTheta: number, alpha: number): number {
  if (cosTheta <= 0) return 0;
  return 1 / (1 + smithLambda(cosTheta, alpha));
}

/** Height-correlated masking-shadowing G2 = 1 / (1 + Lambda(v) + Lambda(l)) (Heitz 2014, eq. 99 from memory). */
export function smithG2HeightCorrelated(cosThetaO: number, cosThetaI: number, alpha: number): number {
  if (cosThetaO <= 0 || cosThetaI <= 0) return 0;
  return 1 / (1 + smithLambda(cosThetaO, alpha) + smithLambda(cosThetaI, alpha));
}

/**
 * Visibility V = G2 / (4 (n.l)(n.v)) for the height-correlated Smith G2 in its combined form
 * 0.5 / (n.l sqrt((n.v)^2 (1 - a^2) + a^2) + n.v sqrt((n.l)^2 (1 - a^2) + a^2)) (Heitz 2014; algebra ours).
 */
export function smithVisibilityHeightCorrelated(cosThetaO: number, cosThetaI: number, alpha: number): number {
  if (cosThetaO <= 0 || cosThetaI <= 0) return 0;
  const a2 = alpha * alpha;
  const lv = cosThetaI * Math.sqrt(cosThetaO * cosThetaO * (1 - a2) + a2);
  const ll = cosThetaO * Math.sqrt(cosThetaI * cosThetaI * (1 - a2) + a2);
  return 0.5 / (lv + ll);
}

/**
 * Samples the distribution of visible normals for direction wo (upper hemisphere), isotropic alpha
 * (Heitz 2018, "Sampling the GGX Distribution of Visible Normals", JCGT 7(4)). Writes wm to out[o..o+2].
 */
export function sampleGgxVndf(out: Float64Array, o: number, woX: number, woY: number, woZ: number, alpha: number, u1: number, u2: number): void {
  // Stretch wo into the hemisphere configuration.
  let vx = alpha * woX;
  let vy = alpha * woY;
  let vz = woZ;
  const vInv = 1 / Math.sqrt(vx * vx + vy * vy + vz * vz);
  vx *= vInv;
  vy *= vInv;
  vz *= vInv;
  // Orthonormal basis around the stretched view direction.
  const lensq = vx * vx + vy * vy;
  let t1x = 1;
  let t1y = 0;
  if (lensq > 0) {
    const inv = 1 / Math.sqrt(lensq);
    t1x = -vy * inv;
    t1y = vx * inv;
  }
  const t2x = -vz * t1y;
  const t2y = vz * t1x;
  const t2z = vx * t1y - vy * t1x;
  // Uniform point on the projected disk, warped towards the visible half.
  const r = Math.sqrt(u1);
  const phi = 2 * PI * u2;
  const p1 = r * Math.cos(phi);
  let p2 = r * Math.sin(phi);
  const s = 0.5 * (1 + vz);
  p2 = (1 - s) * Math.sqrt(Math.max(0, 1 - p1 * p1)) + s * p2;
  const pz = Math.sqrt(Math.max(0, 1 - p1 * p1 - p2 * p2));
  const nx = p1 * t1x + p2 * t2x + pz * vx;
  const ny = p1 * t1y + p2 * t2y + pz * vy;
  const nz = p2 * t2z + pz * vz;
  // Unstretch back to the ellipsoid configuration.
  const mx = alpha * nx;
  const my = alpha * ny;
  const mz = Math.max(0, nz);
  const mInv = 1 / Math.sqrt(mx * mx + my * my + mz * mz);
  out[o] = mx * mInv;
  out[o + 1] = my * mInv;
  out[o + 2] = mz * mInv;
}

/**
 * Density of sampleGgxVndf over the solid angle of wm: G1(wo) max(0, wo.wm) D(wm) / (n.wo) (Heitz 2018, eq. 1).
 * The density of the reflected wi is this divided by 4 |wo.wm|.
 */
export function ggxVndfPdf(woX: number, woY: number, woZ: number, wmX: number, wmY: number, wmZ: number, alpha: number): number {
  if (woZ <= 0) return 0;
  const woDotWm = woX * wmX + woY * wmY + woZ * wmZ;
  if (woDotWm <= 0) return 0;
  return (smithG1(woZ, alpha) * woDotWm * ggxD(wmZ, alpha)) / woZ;
}

/**
 * "Charlie" sheen distribution (Estevez & Kulla 2017, "Production Friendly Microfacet Sheen BRDF",
 * Sony Imageworks tech report): D(h) = (2 + 1/alpha) sin(theta_h)^(1/alpha) / (2 pi).
 */
export function charlieD(cosThetaH: number, alpha: number): number {
  if (cosThetaH <= 0) return 0;
  const invAlpha = 1 / alpha;
  const sin2 = Math.max(0, 1 - cosThetaH * cosThetaH);
  return ((2 + invAlpha) * Math.pow(sin2, 0.5 * invAlpha)) * (0.5 * INV_PI);
}

/**
 * Cloth visibility 1 / (4 (n.l + n.v - n.l n.v)) (Neubelt & Pettineo 2013, "Crafting a Next-Gen Material
 * Pipeline for The Order: 1886", SIGGRAPH course; from memory).
 */
export function neubeltVisibility(cosThetaO: number, cosThetaI: number): number {
  if (cosThetaO <= 0 || cosThetaI <= 0) return 0;
  return 1 / (4 * (cosThetaI + cosThetaO - cosThetaI * cosThetaO));
}
