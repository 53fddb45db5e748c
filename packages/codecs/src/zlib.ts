/** zlib (RFC 1950) inflation with a hard output bound, shared by the EXR and KTX 2.0 readers. */

import { unzlibSync } from 'fflate';
import { corrupt } from './errors.js';

/**
 * Inflates a zlib stream that must hold exactly `size` bytes. The output buffer has room for one byte
 * more, and fflate stops when it is full, so a stream that inflates far past its declared size costs at
 * most size + 1 bytes of work and memory before it is refused.
 */
export function inflateBounded(packed: Uint8Array, size: number, file: string, where: string): Uint8Array {
  let out: Uint8Array;
  try {
    out = unzlibSync(packed, { out: new Uint8Array(size + 1) });
  } catch (error) {
    throw corrupt(file, `invalid zlib data in ${where}: ${error instanceof Error ? error.message : String(error)}`, error);
  }
  if (out.length > size) throw corrupt(file, `${where} inflates past its declared size of ${size} bytes`);
  if (out.length < size) throw corrupt(file, `${where} inflates to ${out.length} bytes, expected ${size}`);
  return out.subarray(0, size);
}
