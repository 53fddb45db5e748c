/**
 * `@lightkiln/bake/warm`: starts the process-wide pool's workers and their kernel warm-up now, before the
 * caller loads the rest of the bake (a command line tool calls it first thing, so thread start-up and the
 * workers' module compilation overlap its own module loading, input reading and decoding). A bake made
 * afterwards with the same thread count (createBaker({ threads })) uses these workers.
 */
import { getSharedPool } from '@lightkiln/pool';
import { KERNEL_MODULE } from './kernel-module.js';
/** threads: as createBaker's (undefined = every core); 0 does nothing. Best effort, never throws. */
export function warmSharedPool(threads) {
    if (threads === 0)
        return;
    try {
        getSharedPool(threads === undefined ? {} : { threads }).warm(KERNEL_MODULE);
    }
    catch {
        // An invalid count is reported by the bake itself.
    }
}
//# sourceMappingURL=warm.js.map