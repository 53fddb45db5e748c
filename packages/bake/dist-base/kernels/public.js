/**
 * `@lightkiln/bake/kernels`: the kernels and the stage helpers that feed them, for benchmarks and tools
 * that drive a single stage (the sample-budget sweep, kernel benchmarks). Not needed to bake.
 */
export { kernels } from './index.js';
export { prefilterSpecular, SPECULAR_SAMPLE_STRIDE, SPECULAR_LEVEL_STRIDE } from './specular.js';
export { referenceSpecular, convolveIrradiance } from './convolve.js';
export { integrateDfgTable } from './dfg.js';
export { resampleCube } from './resample.js';
export { splatEquirect } from './splat.js';
export { Landing } from './splat-bright.js';
export { nodeGeometry } from '../stages/node-geometry.js';
export { reducePyramid } from './reduce.js';
export { buildSampleSet, prefilterLevels, mirrorLevel, referenceQuadrature } from '../stages/specular.js';
export { buildPyramid, pyramidLayout, levelView, sourceDirections, supersampleFactor, splatSubcells } from '../stages/pyramid.js';
export { decodeSource } from '../stages/source.js';
export { bakeDfgTable } from '../stages/dfg.js';
export { projectSh9, irradianceCube, convolutionSource } from '../stages/irradiance.js';
//# sourceMappingURL=public.js.map