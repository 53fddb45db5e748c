/**
 * Deterministic quadrature for tests: composite Gauss-Legendre rules (Abramowitz & Stegun 1964, 25.4.29,
 * the 8-point nodes and weights below, table 25.4), independent of the project's samplers.
 */

const GL8_NODES = [
  -0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498,
  0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363,
];
const GL8_WEIGHTS = [
  0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620,
  0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763,
];

/** Integral of f over [a, b] with `panels` equal panels of 8-point Gauss-Legendre. */
export function integrate1d(f: (x: number) => number, a: number, b: number, panels: number): number {
  const h = (b - a) / panels;
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h;
    for (let k = 0; k < 8; k++) sum += GL8_WEIGHTS[k]! * f(mid + 0.5 * h * GL8_NODES[k]!);
  }
  return sum * 0.5 * h;
}

/** Integral over [a0, b0] x [a1, b1] of f(x, y), tensor Gauss-Legendre. */
export function integrate2d(f: (x: number, y: number) => number, a0: number, b0: number, a1: number, b1: number, panels0: number, panels1: number): number {
  return integrate1d((x) => integrate1d((y) => f(x, y), a1, b1, panels1), a0, b0, panels0);
}

/** Integral of f(direction) over the upper hemisphere (z >= 0) in spherical coordinates. */
export function integrateHemisphere(f: (x: number, y: number, z: number) => number, thetaPanels = 32, phiPanels = 32): number {
  return integrate2d((theta, phi) => {
    const s = Math.sin(theta);
    return f(s * Math.cos(phi), s * Math.sin(phi), Math.cos(theta)) * s;
  }, 0, Math.PI / 2, 0, 2 * Math.PI, thetaPanels, phiPanels);
}

/** Integral of f(direction) over the whole sphere. */
export function integrateSphere(f: (x: number, y: number, z: number) => number, thetaPanels = 48, phiPanels = 48): number {
  return integrate2d((theta, phi) => {
    const s = Math.sin(theta);
    return f(s * Math.cos(phi), s * Math.sin(phi), Math.cos(theta)) * s;
  }, 0, Math.PI, 0, 2 * Math.PI, thetaPanels, phiPanels);
}
