/** What every heavy stage needs: the pool, the kernel module, cancellation and progress. */
import type { KernelRef, WorkerPool } from '@lightkiln/pool';
import type { BakeEvent } from '../events.js';
export interface BakeProgress {
    /** Stage name: "resample", "pyramid", "specular", "irradiance", "dfg", "encode". */
    readonly stage: string;
    /** Work done and total for the stage, in cost units (texels x samples). */
    readonly done: number;
    readonly total: number;
}
export interface StageContext {
    readonly pool: WorkerPool;
    readonly signal: AbortSignal | undefined;
    readonly onProgress: ((progress: BakeProgress) => void) | undefined;
    /** Cost units per tile (texels x samples); default from the pool. */
    readonly targetTileCost: number | undefined;
}
type Kernels = import('../kernels/index.js').BakeKernels;
/** The names of the bake's kernels. */
export type KernelName = keyof Kernels;
/** The parameter object a kernel takes (its fourth argument). */
export type KernelParams<N extends KernelName> = Parameters<Kernels[N]>[3];
/** A typed reference to one of the bake's kernels: a job's params must match the kernel's. */
export declare function kernel<N extends KernelName>(name: N): KernelRef<KernelParams<N>>;
/** Starts the pool's workers and their kernel import now, beside serial work such as decoding. */
export declare function warmPool(ctx: StageContext): void;
/** Pool job options shared by the stages. */
export declare function jobOptions(ctx: StageContext, stage: string): {
    signal?: AbortSignal;
    onProgress?: (p: {
        done: number;
        total: number;
    }) => void;
    targetTileCost?: number;
    priority: 'foreground' | 'background';
};
/**
 * A stage context for one bake call, with the caller's callbacks guarded: a progress or event callback
 * that throws stops the bake (its tiles are aborted) instead of escaping into a worker's promise chain,
 * and the bake then rejects with the callback's error (`failure()`). A non-function callback is an
 * option error. `emit` delivers structured events (progress included).
 */
export declare function guardedContext(pool: WorkerPool, options: {
    readonly signal?: AbortSignal | undefined;
    readonly onProgress?: unknown;
    readonly onEvent?: unknown;
}, targetTileCost: number | undefined): {
    ctx: StageContext;
    emit: (event: BakeEvent) => void;
    failure: () => unknown;
};
export {};
//# sourceMappingURL=context.d.ts.map