/**
 * Per-thread scratch arrays for kernels whose working set scales with the tile (the splat's per-texel
 * sums, its bright-pixel flags): one array per slot, grown when a tile needs more and reused by the
 * thread's later tiles. Fresh multi-megabyte arrays per tile churned the allocator, and the process kept
 * the freed memory: a 1024 bake from a 4096 x 2048 image peaked 60-180 MB higher (measured with
 * /usr/bin/time against MALLOC_MMAP_THRESHOLD_ fixed). Contents are undefined on return: callers fill.
 * Each pool worker has its own (module state); the arrays live as long as the worker.
 */

type Scratch = Float64Array | Uint8Array;

const slots = new Map<string, Scratch>();

/** The thread's array for `slot` (made anew when missing, too short or of another type), cut to `length`. */
function scratch<T extends Scratch>(slot: string, length: number, type: new (n: number) => T): T {
  let a = slots.get(slot);
  if (!(a instanceof type) || a.length < length) {
    a = new type(length);
    slots.set(slot, a);
  }
  return (a as T).subarray(0, length) as T;
}

/** A Float64Array of exactly `length` items over this thread's array for `slot`. */
export function scratchFloat64(slot: string, length: number): Float64Array {
  return scratch(slot, length, Float64Array);
}

/** A Uint8Array of exactly `length` items over this thread's array for `slot`. */
export function scratchUint8(slot: string, length: number): Uint8Array {
  return scratch(slot, length, Uint8Array);
}
