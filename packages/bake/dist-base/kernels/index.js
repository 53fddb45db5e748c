/** The bake's kernel module, loaded by pool workers (built file) and by the inline runner. */
import { convolveIrradiance, referenceSpecular } from './convolve.js';
import { integrateDfgTable } from './dfg.js';
import { reducePyramid } from './reduce.js';
import { resampleCube } from './resample.js';
import { buildNodeTable } from './node-table.js';
import { buildNodeGeometry } from '../stages/node-geometry.js';
import { prefilterQuadrature } from './quadrature.js';
import { projectSh9Rows } from './sh-project.js';
import { splatEquirect } from './splat.js';
export { warmUp } from './warm-up.js';
import { prefilterSpecular } from './specular.js';
export const kernels = {
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
    projectSh9Rows,
};
//# sourceMappingURL=index.js.map