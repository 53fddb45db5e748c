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
export const RETAINED_BYTES = 96 * 2 ** 20;
const slots = new Map();
let retained = 0;
/**
 * The thread's array for `slot` (made anew when missing, too short or of another type), cut to `length`;
 * kept for later tiles while the thread's kept arrays stay within RETAINED_BYTES.
 */
function scratch(slot, length, type) {
    const kept = slots.get(slot);
    if (kept instanceof type && kept.length >= length)
        return kept.subarray(0, length);
    const a = new type(length);
    const freed = kept === undefined ? 0 : kept.byteLength;
    if (retained - freed + a.byteLength <= RETAINED_BYTES) {
        slots.set(slot, a);
        retained += a.byteLength - freed;
    }
    else if (kept !== undefined) {
        // Too big to keep: drop the smaller one too, so the slot holds nothing stale.
        slots.delete(slot);
        retained -= freed;
    }
    return a;
}
/** A Float64Array of exactly `length` items over this thread's array for `slot`. */
export function scratchFloat64(slot, length) {
    return scratch(slot, length, Float64Array);
}
/** A Uint8Array of exactly `length` items over this thread's array for `slot`. */
export function scratchUint8(slot, length) {
    return scratch(slot, length, Uint8Array);
}
//# sourceMappingURL=scratch.js.map