/**
 * Stage 4: the specular chain. Level 0 is the resampled cube; each level m >= 1 holds LD at its texel
 * centres for roughness r_m, by GGX importance sampling (n = v = r) with NoL weights and, when enabled,
 * filtered importance sampling. A level's sample set is built once here and shared by all its texels.
 */

import {
  alphaFromPerceptualRoughness, FOUR_PI, ggxD, hammersleyPoint, luminance, rotateUnit, rotationOffsetsForSeed, sampleGgxHalfVector,
} from '@lightkiln/math';
import { sharedFloat32, sharedFloat64, sharedInt32, type Segment } from '@lightkiln/pool';
import { LEVEL_TABLE_STRIDE, type QuadratureParams } from '../kernels/quadrature.js';
import { NODE_STRIDE, nodeGeometryOnPool, type NodeGeometry } from './node-geometry.js';
import { NODE_TABLE_STRIDE, type NodeTableParams } from '../kernels/node-table.js';
import { SPECULAR_LEVEL_STRIDE, SPECULAR_SAMPLE_STRIDE, type SpecularParams } from '../kernels/specular.js';
import { jobOptions, kernel, type StageContext } from './context.js';
import { levelView, type Pyramid } from './pyramid.js';
import type { LevelDescriptor } from '../recipe.js';

export interface SampleSetOptions {
  readonly sampleCount: number;
  readonly filtered: boolean;
  readonly lodBias: number;
  /** Seed of the level's Cranley-Patterson rotation; 0 = none. */
  readonly rotationSeed: number;
}

/** A level's sample set: per kept sample (lx, ly, lz, NoL, (1 - f) NoL, f NoL) and (offset0, size0, offset1, size1). */
export interface SampleSet {
  readonly directions: Float64Array;
  readonly levels: Int32Array;
  readonly count: number;
}

/**
 * The sample set of one level: h from the Hammersley
 * point i of N (Walter et al. 2007 GGX sampling), l = 2 (n.h) h - n in the local frame (n = v = z),
 * weight NoL, and for filtered importance sampling the source level
 * lod = max(0.5 log2(Omega_s / Omega_p) + bias, 0), Omega_s = 1 / (N p(l)), p(l) = D(h) / 4 (n = v),
 * Omega_p = 4 pi / (6 w^2) for the level-0 face width w (Krivanek & Colbert 2008, "Real-time Shading with Filtered Importance Sampling", CGF 27(4)).
 * Samples with NoL <= 0 are dropped (they carry no weight).
 */
export function buildSampleSet(alpha: number, pyramid: Pyramid, options: SampleSetOptions): SampleSet {
  const n = options.sampleCount;
  const out = new Float64Array(n * SPECULAR_SAMPLE_STRIDE);
  const lv = new Int32Array(n * SPECULAR_LEVEL_STRIDE);
  const h = new Float64Array(3);
  const u = new Float64Array(2);
  const shift = new Float64Array(2);
  rotationOffsetsForSeed(shift, 0, options.rotationSeed);
  const w0 = pyramid.sizes[0]!;
  const omegaP = FOUR_PI / (6 * w0 * w0);
  const maxLevel = pyramid.sizes.length - 1;
  let kept = 0;
  for (let i = 0; i < n; i++) {
    hammersleyPoint(u, 0, i, n);
    sampleGgxHalfVector(h, 0, alpha, rotateUnit(u[0]!, shift[0]!), rotateUnit(u[1]!, shift[1]!));
    const nh = h[2]!;
    const lx = 2 * nh * h[0]!;
    const ly = 2 * nh * h[1]!;
    const lz = 2 * nh * nh - 1;
    if (lz <= 0) continue;
    let lod = 0;
    if (options.filtered) {
      const pdf = ggxD(nh, alpha) / 4;
      const omegaS = 1 / (n * pdf);
      lod = Math.max(0.5 * Math.log2(omegaS / omegaP) + options.lodBias, 0);
      if (lod > maxLevel) lod = maxLevel;
    }
    const l0 = Math.min(Math.floor(lod), maxLevel);
    const l1 = Math.min(l0 + 1, maxLevel);
    const o = kept * SPECULAR_SAMPLE_STRIDE;
    out[o] = lx;
    out[o + 1] = ly;
    out[o + 2] = lz;
    out[o + 3] = lz;
    const frac = l1 === l0 ? 0 : lod - l0;
    out[o + 4] = (1 - frac) * lz;
    out[o + 5] = frac * lz;
    const q = kept * SPECULAR_LEVEL_STRIDE;
    lv[q] = pyramid.offsets[l0]!;
    lv[q + 1] = pyramid.sizes[l0]!;
    lv[q + 2] = pyramid.offsets[l1]!;
    lv[q + 3] = pyramid.sizes[l1]!;
    kept++;
  }
  return { directions: out.slice(0, kept * SPECULAR_SAMPLE_STRIDE), levels: lv.slice(0, kept * SPECULAR_LEVEL_STRIDE), count: kept };
}

/** A level to compute (level >= 1): the recipe's level descriptor. */
export type LevelRequest = LevelDescriptor;

export interface LevelResult {
  readonly level: number;
  readonly size: number;
  /** RGB float32 texels of the six faces. */
  readonly data: Float32Array;
  /** Samples with NoL > 0 actually used per texel. */
  readonly usedSamples: number;
  /**
   * Estimated RMS over texels of the relative luminance error (each texel's error over its own
   * luminance). Quadrature: twice the RMS relative difference against the same tree at half the opening
   * angle on check rows. Sampled: the RMS of each texel's standard error over its luminance (see
   * kernels/specular.ts; conservative for low-discrepancy samples). 0 for level 0 and reference levels.
   */
  readonly relativeErrorEstimate: number;
}

export interface SpecularOptions {
  readonly filtered: boolean;
  readonly lodBias: number;
  readonly clampLuminance: number;
  readonly rotateSequence: boolean;
  readonly quality: 'quadrature' | 'sampled' | 'reference';
}

/**
 * Opening criterion of the hierarchical quadrature: a node is accepted when its angular radius is below
 * QUADRATURE_THETA times the larger of its chord distance from n and QUADRATURE_GAMMA alpha.
 */
export const QUADRATURE_THETA = 0.5;
export const QUADRATURE_GAMMA = 2;
/** Nodes whose largest possible share of a texel's lobe integral is below this are not opened. */
export const QUADRATURE_NEGLIGIBLE = 1e-3;
/**
 * A node whose largest possible share of the lobe integral is s < QUADRATURE_SHARE may be wider: its
 * opening test is scaled by sqrt(s / QUADRATURE_SHARE) (small shares tolerate a coarser weight).
 */
export const QUADRATURE_SHARE = 0.1;
/**
 * Nodes brighter than QUADRATURE_BRIGHT times the local mean luminance (a sun, a lamp) are normalised by
 * the exact lobe integral instead of the quadrature's own sum of weights: their light is resolved down
 * to the finest level, so the weight-sum error of the coarse nodes must not scale it.
 */
export const QUADRATURE_BRIGHT = 4;

/**
 * Integral over the sphere of w(c) = max(c, 0) / (1 + a^2 + c (a^2 - 1))^2 (the kernel's lobe, up to
 * its constant): 2 pi integral_0^1 w(c) dc, by 8-point Gauss-Legendre on panels geometric towards c = 1.
 */
export function lobeIntegral(alphaSquared: number): number {
  const X = [-0.9602898564975363, -0.7966664774136267, -0.525532409916329, -0.1834346424956498, 0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363];
  const Wt = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.362683783378362, 0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];
  let sum = 0;
  let hi = 1;
  let width = Math.max(1e-9, alphaSquared / 8);
  while (hi > 0) {
    const lo = Math.max(0, hi - width);
    for (let k = 0; k < 8; k++) {
      const c = 0.5 * (lo + hi) + 0.5 * (hi - lo) * X[k]!;
      const q = 1 + alphaSquared + c * (alphaSquared - 1);
      sum += 0.5 * (hi - lo) * Wt[k]! * (c / (q * q));
    }
    hi = lo;
    width *= 2;
  }
  return 2 * Math.PI * sum;
}

/**
 * The finest pyramid level the quadrature's tree reaches: level 0, unless the next level's texels are
 * already within the acceptance radius at the peak of the narrowest lobe of the chain (angular radius
 * below QUADRATURE_THETA QUADRATURE_GAMMA alpha), as at 1024 and above with the default roughness
 * spacing; then only light brighter than its surroundings (a sun) would be resolved further, and its
 * luminance centroid and spread stand in for that. Skipping level 0 saves three quarters of the node table.
 * (A pyramid whose base is finer than the output, recipe.ts pyramidBaseSize, is always walked to level 0:
 * that base exists because the output's texels were too coarse for the sharpest lobe.)
 */
export function finestNodeLevel(pyramid: Pyramid, geometry: NodeGeometry, narrowestAlpha: number): number {
  const limit = QUADRATURE_THETA * QUADRATURE_GAMMA * narrowestAlpha;
  let level = 0;
  // The largest radius of a level is at its face centre; rho of the central texel (NODE_STRIDE field 6).
  while (level + 1 < pyramid.sizes.length - 2) {
    const n = pyramid.sizes[level + 1]!;
    const centre = geometry.offsets[level + 1]! + ((n >> 1) * n + (n >> 1)) * NODE_STRIDE;
    if (geometry.data[centre + 6]! > limit) break;
    level++;
  }
  return level;
}

/** The node table of the quadrature (kernels/node-table.ts) for the pyramid levels from `finest` up, one pool job. */
async function buildNodes(pyramid: Pyramid, geometry: NodeGeometry, finest: number, ctx: StageContext): Promise<Float32Array> {
  const first = pyramid.offsets[finest]! / 3;
  const total = pyramid.data.length / 3 - first;
  const nodes = sharedFloat32(total * NODE_TABLE_STRIDE);
  const segments: Segment[] = [];
  const segmentParams: NodeTableParams[] = [];
  pyramid.sizes.forEach((n, k) => {
    if (k < finest) return;
    segments.push({ begin: 0, end: 6 * n * n, costPerItem: 40, rowLength: n, label: `node table level ${k}` });
    segmentParams.push({ size: n, firstTexel: pyramid.offsets[k]! / 3, nodeOffset: pyramid.offsets[k]! / 3 - first, geometryOffset: geometry.offsets[k]! });
  });
  await ctx.pool.run({ kernel: kernel('buildNodeTable'), buffers: { pyramid: pyramid.data, centroids: pyramid.centroids, geometry: geometry.data, nodes }, segments, segmentParams, ...jobOptions(ctx, 'specular') });
  return nodes;
}

/** The default: every requested level by the hierarchical quadrature (kernels/quadrature.ts), one pool job. */
async function quadratureLevels(pyramid: Pyramid, requests: readonly LevelRequest[], ctx: StageContext, exhaustive = false): Promise<LevelResult[]> {
  const geometry = await nodeGeometryOnPool(pyramid.sizes[0]!, ctx);
  const levels = pyramid.sizes.length;
  const narrowest = Math.min(...requests.map((req) => alphaFromPerceptualRoughness(req.perceptualRoughness)));
  const outputSize = requests[0]!.faceSize << requests[0]!.level;
  const finest = exhaustive || pyramid.sizes[0]! > outputSize ? 0 : finestNodeLevel(pyramid, geometry, narrowest);
  const levelTable = sharedInt32(levels * LEVEL_TABLE_STRIDE);
  for (let k = 0; k < levels; k++) {
    levelTable[k * LEVEL_TABLE_STRIDE] = pyramid.sizes[k]!;
    levelTable[k * LEVEL_TABLE_STRIDE + 1] = pyramid.offsets[k]!;
    levelTable[k * LEVEL_TABLE_STRIDE + 2] = k < finest ? 0 : (pyramid.offsets[k]! - pyramid.offsets[finest]!) / 3;
    levelTable[k * LEVEL_TABLE_STRIDE + 3] = geometry.offsets[k]!;
  }
  const topOffset = pyramid.offsets[levels - 1]!;
  let meanLuminance = 0;
  for (let f = 0; f < 6; f++) meanLuminance += luminance(pyramid.data[topOffset + f * 3]!, pyramid.data[topOffset + f * 3 + 1]!, pyramid.data[topOffset + f * 3 + 2]!) / 6;
  let texels = 0;
  const segments = [];
  const segmentParams: QuadratureParams[] = [];
  for (const req of requests) {
    const alpha = alphaFromPerceptualRoughness(req.perceptualRoughness);
    const params: QuadratureParams = {
      size: req.faceSize, levelBegin: texels, dstOffset: texels * 3, alphaSquared: alpha * alpha,
      theta: exhaustive ? 0 : QUADRATURE_THETA, lobeWidth: QUADRATURE_GAMMA * alpha, meanLuminance, levels, finestLevel: finest,
      negligible: exhaustive ? 0 : QUADRATURE_NEGLIGIBLE * lobeIntegral(alpha * alpha),
      lobeIntegral: lobeIntegral(alpha * alpha), brightRatio: QUADRATURE_BRIGHT,
      shareScale: exhaustive ? 0 : 1 / (QUADRATURE_SHARE * lobeIntegral(alpha * alpha)),
    };
    for (let f = 0; f < 6; f++) {
      segments.push({ begin: texels + f * req.faceSize * req.faceSize, end: texels + (f + 1) * req.faceSize * req.faceSize, costPerItem: exhaustive ? 4 * pyramid.sizes[0]! ** 2 : 200, rowLength: req.faceSize, label: `level ${req.level} face ${f}` });
      segmentParams.push(params);
    }
    texels += 6 * req.faceSize * req.faceSize;
  }
  const nodes = await buildNodes(pyramid, geometry, finest, ctx);
  const dst = sharedFloat32(texels * 3);
  const visits = sharedFloat32(texels);
  const buffers = { nodes, geometry: geometry.data, levelTable, dst, visits };
  const walk = ctx.pool.run({ kernel: kernel('prefilterQuadrature'), buffers, segments, segmentParams, ...jobOptions(ctx, 'specular') });
  if (exhaustive) {
    await walk;
    return requests.map((req, r) => {
      const p = segmentParams[r * 6]!;
      return { level: req.level, size: req.faceSize, data: dst.slice(p.dstOffset, p.dstOffset + 6 * req.faceSize * req.faceSize * 3), usedSamples: 6 * pyramid.sizes[0]! ** 2, relativeErrorEstimate: 0 };
    });
  }
  // The error estimate: every 32nd row of every face (at least two rows a face) again with half the
  // opening angle (about four times the nodes, so about an eighth of the level's cost); twice the RMS of
  // the per-texel relative difference. Checked against the exact convolution of sunny skies in
  // test/sunny.test.ts: 1.2-1.8 x the RMS relative error measured there on every level above 0.02%.
  const fine = sharedFloat32(texels * 3);
  const checkSegments: Segment[] = [];
  const checkParams: QuadratureParams[] = [];
  for (let r = 0; r < requests.length; r++) {
    const p = segmentParams[r * 6]!;
    const step = Math.max(1, Math.min(p.size >> 1, 32));
    for (let f = 0; f < 6; f++) {
      for (let y = step >> 1; y < p.size; y += step) {
        const first = p.levelBegin + (f * p.size + y) * p.size;
        checkSegments.push({ begin: first, end: first + p.size, costPerItem: 800, rowLength: p.size, label: `level ${requests[r]!.level} check` });
        checkParams.push({ ...p, theta: p.theta / 2 });
      }
    }
  }
  // Submitted beside the walk (it reads only the node table): the two jobs' tiles interleave, so the
  // workers do not drain between them. Settled together, so no tile outlives a failure.
  const check = ctx.pool.run({ kernel: kernel('prefilterQuadrature'), buffers: { ...buffers, dst: fine, visits: sharedFloat32(texels) }, segments: checkSegments, segmentParams: checkParams, ...jobOptions(ctx, 'specular') });
  const [walkDone, checkDone] = await Promise.allSettled([walk, check]);
  if (walkDone.status === 'rejected') throw walkDone.reason;
  if (checkDone.status === 'rejected') throw checkDone.reason;
  return requests.map((req, r) => {
    const p = segmentParams[r * 6]!;
    const n = 6 * req.faceSize * req.faceSize;
    let sum = 0;
    let sumY = 0;
    for (let t = 0; t < n; t++) {
      sum += visits[p.levelBegin + t]!;
      const o = (p.levelBegin + t) * 3;
      sumY += luminance(dst[o]!, dst[o + 1]!, dst[o + 2]!);
    }
    let se = 0;
    let checked = 0;
    for (let c = 0; c < checkSegments.length; c++) {
      if (checkParams[c]!.levelBegin !== p.levelBegin) continue;
      for (let t = checkSegments[c]!.begin; t < checkSegments[c]!.end; t++) {
        const o = t * 3;
        const yFine = luminance(fine[o]!, fine[o + 1]!, fine[o + 2]!);
        if (!(yFine > 0)) continue;
        const d = (luminance(dst[o]!, dst[o + 1]!, dst[o + 2]!) - yFine) / yFine;
        se += d * d;
        checked++;
      }
    }
    const meanY = sumY / n;
    const estimate = meanY > 0 && checked > 0 ? 2 * Math.sqrt(se / checked) : 0;
    return { level: req.level, size: req.faceSize, data: dst.slice(p.dstOffset, p.dstOffset + n * 3), usedSamples: Math.round(sum / n), relativeErrorEstimate: estimate };
  });
}

/** Computes the requested levels (all >= 1) in one pool job, so tiles of all levels interleave. */
export async function prefilterLevels(pyramid: Pyramid, requests: readonly LevelRequest[], options: SpecularOptions, ctx: StageContext): Promise<LevelResult[]> {
  if (requests.length === 0) return [];
  // The reference: the same leaf model with every level-0 texel a leaf (no tree, no tolerance).
  if (options.quality === 'reference') return quadratureLevels(pyramid, requests, ctx, true);
  if (options.quality === 'quadrature') return quadratureLevels(pyramid, requests, ctx);
  const sets = requests.map((req) => buildSampleSet(alphaFromPerceptualRoughness(req.perceptualRoughness), pyramid, {
    sampleCount: req.requestedSamples,
    filtered: options.filtered,
    lodBias: options.lodBias,
    rotationSeed: options.rotateSequence ? 0x51 + req.level : 0,
  }));
  const totalSamples = sets.reduce((n, s) => n + s.count, 0);
  const samples = sharedFloat64(Math.max(1, totalSamples * SPECULAR_SAMPLE_STRIDE));
  const sampleLevels = sharedInt32(Math.max(1, totalSamples * SPECULAR_LEVEL_STRIDE));
  let sampleOffset = 0;
  let texels = 0;
  const segmentParams: SpecularParams[] = [];
  const segments = [];
  for (let r = 0; r < requests.length; r++) {
    const req = requests[r]!;
    samples.set(sets[r]!.directions, sampleOffset * SPECULAR_SAMPLE_STRIDE);
    sampleLevels.set(sets[r]!.levels, sampleOffset * SPECULAR_LEVEL_STRIDE);
    const count = sets[r]!.count;
    const perLevel = 6 * req.faceSize * req.faceSize;
    let weightSum = 0;
    let weightSquareSum = 0;
    for (let k = 0; k < count; k++) {
      const w = sets[r]!.directions[k * SPECULAR_SAMPLE_STRIDE + 3]!;
      weightSum += w;
      weightSquareSum += w * w;
    }
    const params: SpecularParams = { levelBegin: texels, size: req.faceSize, dstOffset: texels * 3, sampleOffset, sampleCount: count, clampLuminance: options.clampLuminance, weightSum, weightSquareSum };
    for (let f = 0; f < 6; f++) {
      segments.push({ begin: texels + f * req.faceSize * req.faceSize, end: texels + (f + 1) * req.faceSize * req.faceSize, costPerItem: Math.max(1, count), rowLength: req.faceSize, label: `level ${req.level} face ${f}` });
      segmentParams.push(params);
    }
    sampleOffset += count;
    texels += perLevel;
  }
  const dst = sharedFloat32(texels * 3);
  const err = sharedFloat32(texels);
  await ctx.pool.run({ kernel: kernel('prefilterSpecular'), buffers: { pyramid: pyramid.data, samples, sampleLevels, dst, err }, segments, segmentParams, ...jobOptions(ctx, 'specular') });
  return requests.map((req, r) => {
    const p = segmentParams[r * 6]!;
    const n = 6 * req.faceSize * req.faceSize;
    const data = dst.slice(p.dstOffset, p.dstOffset + n * 3);
    let sumRel2 = 0;
    let counted = 0;
    for (let t = 0; t < n; t++) {
      const y = luminance(data[t * 3]!, data[t * 3 + 1]!, data[t * 3 + 2]!);
      if (!(y > 0)) continue;
      const e = err[p.levelBegin + t]! / y;
      sumRel2 += e * e;
      counted++;
    }
    return { level: req.level, size: req.faceSize, data, usedSamples: p.sampleCount, relativeErrorEstimate: counted > 0 ? Math.sqrt(sumRel2 / counted) : 0 };
  });
}

/**
 * Quadrature of the reference for one level: near the lobe peak, points per level-0 texel and axis
 * spaced at most 0.15 of the lobe width (about 2 alpha radians in l) apart (1..8), inside a cone of
 * 5 lobe widths plus two texels around n; one point per texel elsewhere (D varies slowly there).
 */
export function referenceQuadrature(alpha: number, srcSize: number): { subdivision: number; cosNear: number } {
  const texelAngle = 2 / srcSize;
  const lobe = 2 * alpha;
  const subdivision = Math.max(1, Math.min(8, Math.ceil(texelAngle / (0.15 * lobe))));
  return { subdivision, cosNear: Math.cos(Math.min(Math.PI, 5 * lobe + 2 * texelAngle)) };
}

/**
 * Level 0 of the chain, the mirror (r = 0): the pyramid level of the output face size (level 0 unless
 * the base is supersampled), as a view of the pyramid, not a copy (nothing writes to either; a copy was
 * 75 MB more at the peak of a 1024 bake).
 */
export function mirrorLevel(pyramid: Pyramid, size: number = pyramid.sizes[0]!): LevelResult {
  const k = pyramid.sizes.indexOf(size);
  if (k < 0) throw new Error(`internal: no pyramid level of face size ${size}`);
  return { level: 0, size, data: levelView(pyramid, k), usedSamples: 1, relativeErrorEstimate: 0 };
}
