/** Where the bake's kernels live (built `.js`, which pool workers import). A leaf module: nothing heavy loads with it. */
import { builtModuleUrl } from '@lightkiln/pool';
export const KERNEL_MODULE = builtModuleUrl(import.meta.url, './kernels/index.js');
//# sourceMappingURL=kernel-module.js.map