/** What every heavy stage needs: the pool, the kernel module, cancellation and progress. */
import { invalidOption, LightkilnError } from '../errors.js';
import { KERNEL_MODULE } from '../kernel-module.js';
/** A typed reference to one of the bake's kernels: a job's params must match the kernel's. */
export function kernel(name) {
    return { moduleUrl: KERNEL_MODULE, name };
}
/** Starts the pool's workers and their kernel import now, beside serial work such as decoding. */
export function warmPool(ctx) {
    ctx.pool.warm(KERNEL_MODULE);
}
/**
 * Stages off the critical path (resample -> pyramid -> specular levels, the longest chain): their
 * tiles run on the pool's background priority, filling workers that the chain leaves idle (while the
 * input decodes, between levels, at the end) instead of delaying it.
 */
const BACKGROUND_STAGES = new Set(['dfg', 'irradiance']);
/** Pool job options shared by the stages. */
export function jobOptions(ctx, stage) {
    const onProgress = ctx.onProgress;
    return {
        priority: BACKGROUND_STAGES.has(stage) ? 'background' : 'foreground',
        ...(ctx.signal !== undefined ? { signal: ctx.signal } : {}),
        ...(onProgress !== undefined ? { onProgress: (p) => onProgress({ stage, done: p.done, total: p.total }) } : {}),
        ...(ctx.targetTileCost !== undefined ? { targetTileCost: ctx.targetTileCost } : {}),
    };
}
/**
 * A stage context for one bake call, with the caller's callbacks guarded: a progress or event callback
 * that throws stops the bake (its tiles are aborted) instead of escaping into a worker's promise chain,
 * and the bake then rejects with the callback's error (`failure()`). A non-function callback is an
 * option error. `emit` delivers structured events (progress included).
 */
export function guardedContext(pool, options, targetTileCost) {
    const user = options.onProgress;
    const onEvent = options.onEvent;
    if (user !== undefined && typeof user !== 'function')
        throw invalidOption('onProgress', 'must be a function', typeof user);
    if (onEvent !== undefined && typeof onEvent !== 'function')
        throw invalidOption('onEvent', 'must be a function', typeof onEvent);
    if (options.signal !== undefined && !(options.signal instanceof AbortSignal))
        throw invalidOption('signal', 'must be an AbortSignal', typeof options.signal);
    if (user === undefined && onEvent === undefined)
        return { ctx: { pool, signal: options.signal, onProgress: undefined, targetTileCost }, emit: () => undefined, failure: () => undefined };
    const controller = new AbortController();
    const signal = options.signal === undefined ? controller.signal : AbortSignal.any([options.signal, controller.signal]);
    let thrown;
    let failed = false;
    let which = '';
    const guard = (name, fn) => {
        if (failed)
            return;
        try {
            fn();
        }
        catch (error) {
            failed = true;
            thrown = error;
            which = name;
            controller.abort(error);
        }
    };
    const emit = (event) => {
        if (onEvent !== undefined)
            guard('onEvent', () => onEvent(event));
    };
    const onProgress = (progress) => {
        if (user !== undefined)
            guard('onProgress', () => user(progress));
        emit({ type: 'progress', stage: progress.stage, done: progress.done, total: progress.total });
    };
    const failure = () => (failed ? new LightkilnError('BAKE_FAILED', `the ${which} callback threw: ${thrown instanceof Error ? thrown.message : String(thrown)}`, { cause: thrown }) : undefined);
    return { ctx: { pool, signal, onProgress, targetTileCost }, emit, failure };
}
//# sourceMappingURL=context.js.map