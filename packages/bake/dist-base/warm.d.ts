/**
 * `@lightkiln/bake/warm`: starts the process-wide pool's workers and their kernel warm-up now, before the
 * caller loads the rest of the bake (a command line tool calls it first thing, so thread start-up and the
 * workers' module compilation overlap its own module loading, input reading and decoding). A bake made
 * afterwards with the same thread count (createBaker({ threads })) uses these workers.
 */
/** threads: as createBaker's (undefined = every core); 0 does nothing. Best effort, never throws. */
export declare function warmSharedPool(threads: number | undefined): void;
//# sourceMappingURL=warm.d.ts.map