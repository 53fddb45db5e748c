/**
 * Per-thread scratch arrays for kernels whose working set scales with the tile (the splat's per-texel
 * sums, its bright-pixel flags): one array per slot, grown when a tile needs more and reused by the
 * thread's later tiles. Fresh multi-megabyte arrays per tile churned the allocator, and the process kept
 * the freed memory: a 1024 bake from a 4096 x 2048 image peaked 60-180 MB higher (measured with
 * /usr/bin/time against MALLOC_MMAP_THRESHOLD_ fixed). Contents are undefined on return: callers fill.
 * Each pool worker has its own (module state); the arrays live as long as the worker.
 */

const float64Slots = new Map<string, Float64Array>();
const uint8Slots = new Map<string, Uint8Array>();

/** A Float64Array of exactly `length` items over this thread's array for `slot`. */
export function scratchFloat64(slot: string, length: number): Float64Array {
  let a = float64Slots.get(slot);
  if (a === undefined || a.length < length) {
    a = new Float64Array(length);
    float64Slots.set(slot, a);
  }
  return a.subarray(0, length);
}

/** A Uint8Array of exactly `length` items over this thread's array for `slot`. */
export function scratchUint8(slot: string, length: number): Uint8Array {
  let a = uint8Slots.get(slot);
  if (a === undefined || a.length < length) {
    a = new Uint8Array(length);
    uint8Slots.set(slot, a);
  }
  return a.subarray(0, length);
}
