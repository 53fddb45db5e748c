/** The bake's kernel module, loaded by pool workers (built file) and by the inline runner. */

import type { KernelModule } from '@lightkiln/pool';
import { convolveIrradiance, referenceSpecular } from './convolve.js';
import { integrateDfgTable } from './dfg.js';
import { reducePyramid } from './reduce.js';
import { resampleCube, resampleEquirect } from './resample.js';
import { buildNodeTable } from './node-table.js';
import { buildNodeGeometry } from '../stages/node-geometry.js';
import { prefilterQuadrature } from './quadrature.js';
import { splatEquirect } from './splat.js';
export { warmUp } from './warm-up.js';
import { prefilterSpecular } from './specular.js';

export const kernels: KernelModule['kernels'] = {
  resampleEquirect,
  resampleCube,
  reducePyramid,
  prefilterSpecular,
  prefilterQuadrature,
  buildNodeTable,
  buildNodeGeometry,
  splatEquirect,
  referenceSpecular,
  convolveIrradiance,
  integrateDfgTable,
} as unknown as KernelModule['kernels'];
