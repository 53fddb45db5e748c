/**
 * The split-sum DFG terms by a deterministic quadrature (same integrands as dfg.ts: A = integral f (1 - Fc)
 * (n.l) dl, B = integral f Fc (n.l) dl, GGX D, height-correlated Smith G2, Schlick Fc = (1 - v.h)^5;
 * Karis 2013). Variables: the GGX half-vector CDF u in [0, 1) (D(h) (n.h) dh = du dphi / (2 pi),
 * tan^2 theta_h = a^2 u / (1 - u), Walter et al. 2007) and the azimuth phi of h from v's plane. With
 * l = 2 (v.h) h - v the integrand per unit du dphi / (2 pi) is G2 (v.h) / ((n.h)(n.v)) times (1 - Fc) or Fc.
 * The horizon n.l > 0 is an integration limit, not a cut: for a given theta_h it holds for
 * cos phi > c0 = n.v (1 / (2 cos theta_h) - cos theta_h) / (sin theta_v sin theta_h) (ours, from
 * n.l = 2 (v.h)(n.h) - n.v with v.h = sin theta_v sin theta_h cos phi + n.v cos theta_h), so phi runs over
 * [0, acos(c0)] (the integrand is even in phi) and the phi-integral is smooth inside. Over theta_h, panels
 * are geometric in 1 - u (uniform in log tan theta_h, where D spreads), with breaks where c0 = -1 and c0 = 1
 * (past the latter no light direction is above the horizon). 8-point Gauss-Legendre on every panel
 * (Abramowitz & Stegun 1964, table 25.4), 8 points over phi.
 */

const GL_X = [-0.9602898564975363, -0.7966664774136267, -0.525532409916329, -0.1834346424956498, 0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363];
const GL_W = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.362683783378362, 0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];

/** Gauss-Legendre panels over the lit azimuth range (8 points each). */
const PHI_PANELS = 1;

/** cos phi bound of the horizon for tan^2 theta_h = t2 (see the module comment); may lie outside [-1, 1]. */
function horizonCos(mu: number, sinV: number, t2: number): number {
  const c = 1 / Math.sqrt(1 + t2);
  const s = Math.sqrt(t2) * c;
  return (mu * (0.5 / c - c)) / (sinV * s);
}

/** 1 - u for the theta_h where horizonCos = target (bisection on tan^2 theta_h; c0 increases with theta_h). */
function breakAt(mu: number, sinV: number, a2: number, target: number): number {
  let lo = 0;
  let hi = 1e12;
  for (let i = 0; i < 200; i++) {
    const mid = Math.sqrt(Math.max(lo, 1e-300) * hi);
    if (horizonCos(mu, sinV, mid) < target) lo = mid;
    else hi = mid;
    if (hi / Math.max(lo, 1e-300) < 1 + 1e-13) break;
  }
  const t2 = Math.sqrt(Math.max(lo, 1e-300) * hi);
  return a2 / (a2 + t2);
}

/** Sums one u-panel [1 - w1, 1 - w0] (w = 1 - u, w0 < w1) into acc[0..1]. */
function panel(acc: Float64Array, mu: number, sinV: number, a2: number, lambdaV: number, w0: number, w1: number): void {
  for (let i = 0; i < 8; i++) {
    const w = 0.5 * (w0 + w1) + 0.5 * (w1 - w0) * GL_X[i]!;
    const wu = 0.5 * (w1 - w0) * GL_W[i]!;
    const t2 = (a2 * (1 - w)) / w;
    const cosH = 1 / Math.sqrt(1 + t2);
    const sinH = Math.sqrt(t2) * cosH;
    let c0 = sinV > 0 && sinH > 0 ? (mu * (0.5 / cosH - cosH)) / (sinV * sinH) : mu < 2 * cosH * cosH * mu ? -2 : 2;
    if (c0 >= 1) continue;
    if (c0 < -1) c0 = -1;
    const phiMax = Math.acos(c0);
    let sa = 0;
    let sb = 0;
    for (let half = 0; half < PHI_PANELS; half++) {
      const p0 = (half * phiMax) / PHI_PANELS;
      const p1 = p0 + phiMax / PHI_PANELS;
      for (let j = 0; j < 8; j++) {
        const phi = 0.5 * (p0 + p1) + 0.5 * (p1 - p0) * GL_X[j]!;
        const vDotH = sinV * sinH * Math.cos(phi) + mu * cosH;
        const nDotL = 2 * vDotH * cosH - mu;
        if (nDotL <= 0 || vDotH <= 0) continue;
        const nl2 = nDotL * nDotL;
        const lambdaL = 0.5 * (-1 + Math.sqrt(1 + (a2 * (1 - nl2)) / nl2));
        const g = (0.5 * (p1 - p0) * GL_W[j]! * vDotH) / ((1 + lambdaV + lambdaL) * cosH * mu);
        const m = 1 - vDotH;
        const m2 = m * m;
        const fc = m2 * m2 * m;
        sa += (1 - fc) * g;
        sb += fc * g;
      }
    }
    // du dphi / (2 pi) over phi in [-phiMax, phiMax]: twice the half range, over 2 pi.
    acc[0] = acc[0]! + (wu * sa) / Math.PI;
    acc[1] = acc[1]! + (wu * sb) / Math.PI;
  }
}

/**
 * Writes A to out[o] and B to out[o + 1] for n.v = nDotV in (0, 1] and GGX alpha > 0, to about 1e-6
 * (see the module comment). `scratch` is a Float64Array of at least 2 (no allocation per call).
 */
export function integrateDfgExact(out: Float64Array, o: number, nDotV: number, alpha: number, scratch: Float64Array): void {
  const mu = Math.min(1, Math.max(1e-7, nDotV));
  const sinV = Math.sqrt(Math.max(0, 1 - mu * mu));
  const a2 = Math.max(alpha * alpha, 1e-14);
  // Lambda(v) with tan^2 = (1 - mu^2) / mu^2 (Heitz 2014).
  const lambdaV = 0.5 * (-1 + Math.sqrt(1 + (a2 * (1 - mu * mu)) / (mu * mu)));
  scratch[0] = 0;
  scratch[1] = 0;
  // Breaks in w = 1 - u: where the horizon starts cutting phi (c0 = -1) and where nothing is left (c0 = 1).
  // At n.v = 1 every phi is lit up to theta_h = 45 degrees (tan^2 = 1) and none past it.
  const wCut = sinV > 0 ? breakAt(mu, sinV, a2, -1) : a2 / (a2 + 1);
  const wEnd = sinV > 0 ? breakAt(mu, sinV, a2, 1) : a2 / (a2 + 1);
  // Geometric panels from w = 1 down to wEnd, with wCut as an extra break; the u-mass left below
  // w = 1e-10 is dropped (the integrand is at most about 1 / n.v there, so below 1e-6 for n.v > 1e-4).
  let w1 = 1;
  while (w1 > wEnd * (1 + 1e-12) && w1 > 1e-10) {
    let w0 = Math.max(wEnd, 0.5 * w1);
    if (w1 > wCut && w0 < wCut) w0 = wCut;
    if (w0 <= 1e-300) w0 = 0;
    panel(scratch, mu, sinV, a2, lambdaV, w0, w1);
    if (w0 === 0) break;
    w1 = w0;
  }
  out[o] = scratch[0]!;
  out[o + 1] = scratch[1]!;
}
