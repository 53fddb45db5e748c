/**
 * Warm-up of a pool worker (WorkerPool.warm): the default chain's stages run once, inline in the worker,
 * on a tiny synthetic sky with a bright spot, so every branch of the hot kernels has type feedback before
 * the first real tile. Without it, a long tile compiled on partial feedback deoptimises as soon as it
 * meets a new branch (measured: the equirect splat of a 256 bake ran 2.5 x slower cold than warm).
 */
export declare function warmUp(): Promise<void>;
//# sourceMappingURL=warm-up.d.ts.map