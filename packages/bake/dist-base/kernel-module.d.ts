/** Where the bake's kernels live (built `.js`, which pool workers import). A leaf module: nothing heavy loads with it. */
export declare const KERNEL_MODULE: string;
//# sourceMappingURL=kernel-module.d.ts.map