/**
 * Per-thread scratch arrays for kernels whose working set scales with the tile (the splat's per-texel
 * sums, its bright-pixel flags): one array per slot, grown when a tile needs more and reused by the
 * thread's later tiles. Fresh multi-megabyte arrays per tile churned the allocator, and the process kept
 * the freed memory: a 1024 bake from a 4096 x 2048 image peaked 60-180 MB higher (measured with
 * /usr/bin/time against MALLOC_MMAP_THRESHOLD_ fixed). Contents are undefined on return: callers fill.
 * Each pool worker has its own (module state); the arrays live as long as the worker, so a thread keeps
 * at most RETAINED_BYTES of them (a 1024 splat needs 67 MB): larger working sets (2048 and up) get fresh
 * arrays per tile, as before, instead of pinning gigabytes in idle workers after a big bake.
 */
/** Bytes of scratch a thread keeps between tiles. */
export declare const RETAINED_BYTES: number;
/** A Float64Array of exactly `length` items over this thread's array for `slot`. */
export declare function scratchFloat64(slot: string, length: number): Float64Array;
/** A Uint8Array of exactly `length` items over this thread's array for `slot`. */
export declare function scratchUint8(slot: string, length: number): Uint8Array;
//# sourceMappingURL=scratch.d.ts.map