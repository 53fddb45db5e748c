/** Typed arrays over SharedArrayBuffer: images are allocated once and written in place by the workers. */

export type SharedTypedArray = Float32Array | Float64Array | Int32Array | Uint32Array | Uint8Array | Uint16Array;
export type SharedBuffers = Readonly<Record<string, SharedTypedArray>>;

export function sharedFloat32(length: number): Float32Array {
  return new Float32Array(new SharedArrayBuffer(length * 4));
}

export function sharedFloat64(length: number): Float64Array {
  return new Float64Array(new SharedArrayBuffer(length * 8));
}

export function sharedInt32(length: number): Int32Array {
  return new Int32Array(new SharedArrayBuffer(length * 4));
}

/** A shared copy of any typed array (used to move a decoded image into shared memory once). */
export function toShared<T extends SharedTypedArray>(array: T): T {
  if (array.buffer instanceof SharedArrayBuffer) return array;
  const ctor = array.constructor as new (buffer: SharedArrayBuffer) => T;
  const copy = new ctor(new SharedArrayBuffer(array.byteLength));
  (copy as unknown as { set(a: ArrayLike<number>): void }).set(array as unknown as ArrayLike<number>);
  return copy;
}

export function isShared(array: SharedTypedArray): boolean {
  return array.buffer instanceof SharedArrayBuffer;
}
