/** Where the bake's kernels live (built `.js`, which pool workers import). A leaf module: nothing heavy loads with it. */

import { builtModuleUrl } from '@lightkiln/pool';

export const KERNEL_MODULE: string = builtModuleUrl(import.meta.url, './kernels/index.js');
