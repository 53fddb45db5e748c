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
/** Every kernel by name; stages/context.ts derives each kernel's parameter type from this interface. */
export interface BakeKernels {
    readonly resampleCube: typeof resampleCube;
    readonly reducePyramid: typeof reducePyramid;
    readonly prefilterSpecular: typeof prefilterSpecular;
    readonly prefilterQuadrature: typeof prefilterQuadrature;
    readonly buildNodeTable: typeof buildNodeTable;
    readonly buildNodeGeometry: typeof buildNodeGeometry;
    readonly splatEquirect: typeof splatEquirect;
    readonly referenceSpecular: typeof referenceSpecular;
    readonly convolveIrradiance: typeof convolveIrradiance;
    readonly integrateDfgTable: typeof integrateDfgTable;
    readonly projectSh9Rows: typeof projectSh9Rows;
}
export declare const kernels: BakeKernels;
//# sourceMappingURL=index.d.ts.map