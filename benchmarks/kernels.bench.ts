/**
 * The other kernels, one thread (inline): splatting an equirect onto a cube, the pyramid reduction, the
 * direct irradiance convolution and the reference quadrature, in evaluations per second.
 */

import { sharedFloat32, toShared, WorkerPool } from '@lightkiln/pool';
import { buildPyramid, convolutionSource, convolveIrradiance, nodeGeometry, reducePyramid, referenceQuadrature, referenceSpecular, splatEquirect, splatSubcells } from '@lightkiln/bake/kernels';
import { record, runBench, syntheticSky } from './common.js';

export async function kernelsBench(): Promise<void> {
  const W = 2048;
  const sky = syntheticSky(W, W / 2);
  const source = { kind: 'equirect' as const, width: W, height: W / 2, data: toShared(sky), sanitized: { nan: 0, infinite: 0, negative: 0, clampedHigh: 0 } };
  const inline = new WorkerPool({ threads: 0 });
  const pyramid = await buildPyramid(source, 256, 0, { pool: inline, signal: undefined, onProgress: undefined, targetTileCost: undefined });
  const size = 256;
  const subcells = splatSubcells(W, W / 2, size);
  const splatBuffers = { src: source.data, pyramid: sharedFloat32(6 * size * size * 3), centroids: sharedFloat32(6 * size * size * 3), geometry: nodeGeometry(size).data };
  const splatParams = { size, srcWidth: W, srcHeight: W / 2, subcells, rotCos: 1, rotSin: 0, brightLuminance: Infinity, brightRefinement: 1 };
  // The stage's tiles: half faces.
  const splatAll = (): void => {
    for (let h = 0; h < 12; h++) splatEquirect(splatBuffers, (h * size * size) / 2, ((h + 1) * size * size) / 2, splatParams);
  };
  const reduceParams = { size: 128, srcOffset: pyramid.offsets[0]!, dstOffset: pyramid.offsets[1]! };
  const level = 2; // 64^2 source faces for the convolution
  const convSource = convolutionSource(pyramid, level);
  const irr = sharedFloat32(6 * 32 * 32 * 3);
  const n64 = pyramid.sizes[level]!;
  const irrParams = { srcOffset: pyramid.offsets[level]!, srcTexels: 6 * n64 * n64, size: 32, levelBegin: 0, dstOffset: 0 };
  // Reference: a 16^2 output level at r = 0.5 over the 64^2 level-0 cube of a smaller pyramid.
  const small = await buildPyramid(source, 64, 0, { pool: inline, signal: undefined, onProgress: undefined, targetTileCost: undefined });
  const q = referenceQuadrature(0.25, 64);
  const refDst = sharedFloat32(6 * 16 * 16 * 3);
  const refParams = { srcSize: 64, subdivision: q.subdivision, cosNear: q.cosNear, size: 16, levelBegin: 0, dstOffset: 0, alpha: 0.25 };
  const results = await runBench('kernels, one thread', {
    'splat 2048x1024 -> 6x256^2': splatAll,
    'reduce 256 -> 128': () => reducePyramid({ pyramid: pyramid.data }, 0, 6 * 128 * 128, reduceParams),
    'irradiance 6x32^2 from 6x64^2': () => convolveIrradiance({ srcDirs: convSource, dst: irr }, 0, 6 * 32 * 32, irrParams),
    'reference 6x16^2 over 6x64^2': () => referenceSpecular({ pyramid: small.data, dst: refDst }, 0, 6 * 16 * 16, refParams),
  }, { iterations: 5 });
  record('equirect splat', (W * (W / 2) * subcells * subcells) / (results['splat 2048x1024 -> 6x256^2']!.medianMs / 1000) / 1e6, 'M sub-cells/s/thread', `${subcells}x${subcells} sub-cells per pixel`);
  record('pyramid reduction', (6 * 128 * 128) / (results['reduce 256 -> 128']!.medianMs / 1000) / 1e6, 'M texels/s/thread');
  record('irradiance convolution', (6 * 32 * 32 * 6 * 64 * 64) / (results['irradiance 6x32^2 from 6x64^2']!.medianMs / 1000) / 1e6, 'M texel pairs/s/thread');
  record('reference quadrature', (6 * 16 * 16 * 6 * 64 * 64) / (results['reference 6x16^2 over 6x64^2']!.medianMs / 1000) / 1e6, 'M source texels/s/thread', `fine ${q.subdivision}^2 points near the peak`);
  await inline.close();
}
