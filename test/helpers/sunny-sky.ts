/**
 * Sunny skies of our own making for the accuracy tests: a smooth analytic sky plus a sun disc, rendered
 * into an equirect image by this file (pixel averages, the disc by 64 x 64 coverage points), and the exact
 * split-sum prefilter LD(n) = integral L(l) D(h) max(n.l, 0) dl / integral D(h) max(n.l, 0) dl computed
 * here by composite Gauss-Legendre quadrature (Abramowitz & Stegun 1964, table 25.4) over the analytic
 * function. It shares no code with the bake: no pyramid, no cube, no kernel.
 * GGX D (Walter et al. 2007, eq. 33); n.h = sqrt((1 + n.l) / 2) with v = n (half-angle identity).
 */

export interface Sun {
  /** Unit direction of the sun centre. */
  readonly direction: readonly [number, number, number];
  /** Angular diameter in degrees. */
  readonly diameterDeg: number;
  /** Sun radiance as a multiple of the sky's luminance in the sun's direction. */
  readonly ratio: number;
}

export interface SunnySky {
  readonly sun: Sun | null;
  /** Sky radiance (RGB) in a direction, smooth. */
  readonly sky: (x: number, y: number, z: number) => [number, number, number];
  /** Sun radiance (RGB), constant over the disc. */
  readonly sunRadiance: [number, number, number];
  readonly sunRadiusRad: number;
}

const GL8_X = [-0.9602898564975363, -0.7966664774136267, -0.525532409916329, -0.1834346424956498, 0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363];
const GL8_W = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.362683783378362, 0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];

const lum = (c: readonly number[]): number => 0.2126 * c[0]! + 0.7152 * c[1]! + 0.0722 * c[2]!;

/** A clear sky: ground, horizon-to-zenith blend and a warm glow around the sun (all smooth), plus the sun. */
export function makeSunnySky(sun: Sun | null, glowDirection: readonly [number, number, number] = [0.3, 0.4, -0.866]): SunnySky {
  const g = sun?.direction ?? glowDirection;
  const gl = Math.hypot(g[0], g[1], g[2]);
  const gx = g[0] / gl; const gy = g[1] / gl; const gz = g[2] / gl;
  const sky = (x: number, y: number, z: number): [number, number, number] => {
    const t = 0.5 + 0.5 * Math.tanh(5 * y);
    const glow = 1.5 * Math.exp(6 * (x * gx + y * gy + z * gz - 1));
    const high = 0.5 + 0.5 * y;
    return [
      0.25 * (1 - t) + (0.35 + 0.15 * high) * t + glow,
      0.22 * (1 - t) + (0.5 + 0.2 * high) * t + 0.8 * glow,
      0.2 * (1 - t) + (0.9 + 0.3 * high) * t + 0.5 * glow,
    ];
  };
  if (sun === null) return { sun, sky, sunRadiance: [0, 0, 0], sunRadiusRad: 0 };
  const at = sky(gx, gy, gz);
  const y = lum(at) * sun.ratio;
  // A warm white sun: colour (1, 0.95, 0.85) scaled to the wanted luminance.
  const k = y / lum([1, 0.95, 0.85]);
  return { sun: { ...sun, direction: [gx, gy, gz] }, sky, sunRadiance: [k, 0.95 * k, 0.85 * k], sunRadiusRad: (sun.diameterDeg * Math.PI) / 360 };
}

function equirectDirection(u: number, v: number, out: Float64Array): void {
  // u = 0.5 + atan2(x, -z) / (2 pi), v = acos(y) / pi; row 0 is +Y, the centre looks towards -Z.
  const phi = (u - 0.5) * 2 * Math.PI;
  const theta = v * Math.PI;
  out[0] = Math.sin(theta) * Math.sin(phi);
  out[1] = Math.cos(theta);
  out[2] = -Math.sin(theta) * Math.cos(phi);
}

/** The sky as a W x H equirect RGB float32 image: per pixel the solid-angle mean of 4 x 4 points, 64 x 64 near the sun. */
export function renderEquirect(env: SunnySky, width: number, height: number): Float32Array {
  const data = new Float32Array(width * height * 3);
  const d = new Float64Array(3);
  const s = env.sun;
  const cosNear = s === null ? 2 : Math.cos(env.sunRadiusRad + (4 * Math.PI) / height);
  const cosSun = Math.cos(env.sunRadiusRad);
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      equirectDirection((i + 0.5) / width, (j + 0.5) / height, d);
      const near = s !== null && d[0]! * s.direction[0] + d[1]! * s.direction[1] + d[2]! * s.direction[2] > cosNear;
      const k = near ? 64 : 4;
      let r = 0; let g = 0; let b = 0; let w = 0;
      for (let sy = 0; sy < k; sy++) {
        const v = (j + (sy + 0.5) / k) / height;
        const weight = Math.sin(v * Math.PI);
        for (let sx = 0; sx < k; sx++) {
          equirectDirection((i + (sx + 0.5) / k) / width, v, d);
          const c = env.sky(d[0]!, d[1]!, d[2]!);
          r += c[0] * weight; g += c[1] * weight; b += c[2] * weight;
          if (near && d[0]! * s!.direction[0] + d[1]! * s!.direction[1] + d[2]! * s!.direction[2] >= cosSun) {
            r += env.sunRadiance[0] * weight; g += env.sunRadiance[1] * weight; b += env.sunRadiance[2] * weight;
          }
          w += weight;
        }
      }
      const o = (j * width + i) * 3;
      data[o] = r / w; data[o + 1] = g / w; data[o + 2] = b / w;
    }
  }
  return data;
}

/** w(c) = D(h) max(c, 0) with alpha^2 = a2, up to the constant a2 / pi that cancels in LD. */
function lobe(c: number, a2: number): number {
  if (c <= 0) return 0;
  const q = 1 + a2 + c * (a2 - 1);
  return c / (q * q);
}

/** Panels in the angle psi from n: geometric near the peak (the lobe is about 2 alpha wide), up to pi / 2. */
function psiPanels(alpha: number): number[] {
  const edges = [0];
  let e = Math.min(alpha / 8, 0.01);
  while (e < Math.PI / 2) {
    edges.push(e);
    e *= 1.6;
  }
  edges.push(Math.PI / 2);
  return edges;
}

/** Exact LD(n) (RGB) of the analytic sky at perceptual roughness r > 0, written to out[0..2]. */
export function exactPrefiltered(env: SunnySky, nx: number, ny: number, nz: number, perceptualRoughness: number, out: Float64Array): void {
  const alpha = perceptualRoughness * perceptualRoughness;
  const a2 = alpha * alpha;
  const edges = psiPanels(alpha);
  // Orthonormal frame around n (Duff et al. 2017, "Building an Orthonormal Basis, Revisited").
  const sign = nz >= 0 ? 1 : -1;
  const a = -1 / (sign + nz);
  const bb = nx * ny * a;
  const tx = 1 + sign * nx * nx * a; const ty = sign * bb; const tz = -sign * nx;
  const bx = bb; const by = sign + ny * ny * a; const bz = -ny;
  let r = 0; let g = 0; let b = 0; let den = 0;
  const PHI = 48;
  for (let p = 0; p + 1 < edges.length; p++) {
    const lo = edges[p]!; const hi = edges[p + 1]!;
    for (let k = 0; k < 8; k++) {
      const psi = 0.5 * (lo + hi) + 0.5 * (hi - lo) * GL8_X[k]!;
      const wPsi = 0.5 * (hi - lo) * GL8_W[k]! * Math.sin(psi);
      const cp = Math.cos(psi); const spsi = Math.sin(psi);
      const w = lobe(cp, a2) * wPsi;
      den += w * 2 * Math.PI;
      for (let q = 0; q < PHI; q++) {
        const phi = ((q + 0.5) * 2 * Math.PI) / PHI;
        const c1 = Math.cos(phi) * spsi; const c2 = Math.sin(phi) * spsi;
        const lx = nx * cp + tx * c1 + bx * c2;
        const ly = ny * cp + ty * c1 + by * c2;
        const lz = nz * cp + tz * c1 + bz * c2;
        const L = env.sky(lx, ly, lz);
        const f = (w * 2 * Math.PI) / PHI;
        r += L[0] * f; g += L[1] * f; b += L[2] * f;
      }
    }
  }
  if (env.sun !== null) {
    // The disc, in polar coordinates around the sun centre: 2 x 8 GL points in radius, 64 in angle.
    const s = env.sun.direction;
    const sign2 = s[2] >= 0 ? 1 : -1;
    const a2s = -1 / (sign2 + s[2]);
    const b2 = s[0] * s[1] * a2s;
    const ux = 1 + sign2 * s[0] * s[0] * a2s; const uy = sign2 * b2; const uz = -sign2 * s[0];
    const vx = b2; const vy = sign2 + s[1] * s[1] * a2s; const vz = -s[1];
    const R = env.sunRadiusRad;
    let sum = 0;
    const SPHI = 64;
    for (let half = 0; half < 2; half++) {
      const lo = (half * R) / 2; const hi = ((half + 1) * R) / 2;
      for (let k = 0; k < 8; k++) {
        const rr = 0.5 * (lo + hi) + 0.5 * (hi - lo) * GL8_X[k]!;
        const wr = 0.5 * (hi - lo) * GL8_W[k]! * Math.sin(rr);
        const cr = Math.cos(rr); const sr = Math.sin(rr);
        for (let q = 0; q < SPHI; q++) {
          const phi = ((q + 0.5) * 2 * Math.PI) / SPHI;
          const c1 = Math.cos(phi) * sr; const c2 = Math.sin(phi) * sr;
          const lx = s[0] * cr + ux * c1 + vx * c2;
          const ly = s[1] * cr + uy * c1 + vy * c2;
          const lz = s[2] * cr + uz * c1 + vz * c2;
          sum += lobe(nx * lx + ny * ly + nz * lz, a2) * wr * ((2 * Math.PI) / SPHI);
        }
      }
    }
    r += env.sunRadiance[0] * sum; g += env.sunRadiance[1] * sum; b += env.sunRadiance[2] * sum;
  }
  out[0] = r / den; out[1] = g / den; out[2] = b / den;
}

/**
 * Error figures of test against ref (RGB arrays, BT.709 luminance): rmse, the RMS error over the mean of
 * ref (dominated by the brightest texels where a sun is in view); relRms, the RMS of the per-texel
 * relative error; p999 and max of the per-texel relative error.
 */
export function errorStats(test: ArrayLike<number>, ref: ArrayLike<number>, stride = 3): { rmse: number; relRms: number; p999: number; max: number } {
  const n = ref.length / 3;
  let se = 0; let sy = 0; let sr = 0;
  const rel: number[] = [];
  for (let t = 0; t < n; t++) {
    const yr = 0.2126 * ref[t * 3]! + 0.7152 * ref[t * 3 + 1]! + 0.0722 * ref[t * 3 + 2]!;
    const yt = 0.2126 * test[t * stride]! + 0.7152 * test[t * stride + 1]! + 0.0722 * test[t * stride + 2]!;
    se += (yt - yr) ** 2; sy += yr;
    const e = Math.abs(yt - yr) / yr;
    sr += e * e;
    rel.push(e);
  }
  rel.sort((x, y) => x - y);
  return { rmse: Math.sqrt(se / n) / (sy / n), relRms: Math.sqrt(sr / n), p999: rel[Math.min(n - 1, Math.floor(0.999 * n))]!, max: rel[n - 1]! };
}
