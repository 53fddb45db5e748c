/**
 * Zstandard frames (RFC 8878) for KTX 2.0 supercompression scheme 2. Encoding uses the reference zstd
 * library compiled to WebAssembly (@bokuweb/zstd-wasm; chosen over zstd-codec in
 * benchmarks/codecs.bench.ts), which must be initialised once (initZstd, async); decoding uses fzstd, a
 * synchronous pure-JS decoder, into a buffer of the size the KTX level index and the frame header both
 * declare (anything else is refused before decoding).
 */

import { decompress as fzstdDecompress } from 'fzstd';
import { CodecError } from './errors.js';

type ZstdModule = { init(): Promise<void>; compress(data: Uint8Array, level?: number): Uint8Array };
let wasm: ZstdModule | null = null;
let ready: Promise<void> | null = null;
let initialised = false;

/**
 * Loads the encoder (once per thread; the module itself is imported only then, so programs that never
 * write Zstandard do not pay for it); needed before encodeKtx2 with supercompression 'zstd'.
 */
export function initZstd(): Promise<void> {
  ready ??= import('@bokuweb/zstd-wasm').then(async (m) => {
    const mod = ((m as unknown as { default?: ZstdModule }).default ?? (m as unknown as ZstdModule));
    await mod.init();
    wasm = mod;
    initialised = true;
  });
  return ready;
}

export function zstdReady(): boolean {
  return initialised;
}

/** One Zstandard frame of `data` at `level` (1..19; default 3). */
export function zstdCompress(data: Uint8Array, level = 3, file = 'output'): Uint8Array {
  if (!initialised || wasm === null) throw new CodecError('INVALID_ARGUMENT', file, 'Zstandard encoder not initialised: await initZstd() first');
  return Uint8Array.from(wasm.compress(data, level));
}

/**
 * Frame_Content_Size of the first frame (RFC 8878, section 3.1.1.1), or -1 when absent or unreadable.
 */
function frameContentSize(packed: Uint8Array): number {
  if (packed.length < 6 || packed[0] !== 0x28 || packed[1] !== 0xb5 || packed[2] !== 0x2f || packed[3] !== 0xfd) return -1;
  const fhd = packed[4]!;
  const fcsFlag = fhd >> 6;
  const singleSegment = (fhd >> 5) & 1;
  const dictIdBytes = [0, 1, 2, 4][fhd & 3]!;
  const fcsBytes = fcsFlag === 0 ? singleSegment : 1 << fcsFlag;
  if (fcsBytes === 0) return -1;
  let p = 5 + (singleSegment ? 0 : 1) + dictIdBytes;
  if (p + fcsBytes > packed.length) return -1;
  let value = 0;
  for (let i = 0; i < fcsBytes; i++) value += packed[p + i]! * 2 ** (8 * i);
  if (fcsBytes === 2) value += 256;
  return value;
}

/**
 * Decompresses exactly `size` bytes, or throws CodecError: the frame must declare its content size and it
 * must be `size` (so the output is bounded before any work), and the data must decode.
 */
export function zstdDecompressExactly(packed: Uint8Array, size: number, file: string, where: string): Uint8Array {
  const declared = frameContentSize(packed);
  if (declared < 0) throw new CodecError('CORRUPT', file, `${where}: not a Zstandard frame with a declared content size`);
  if (declared !== size) throw new CodecError('CORRUPT', file, `${where} declares ${declared} bytes of content, expected ${size}`);
  const out = new Uint8Array(size);
  try {
    fzstdDecompress(packed, out);
  } catch (error) {
    throw new CodecError('CORRUPT', file, `invalid Zstandard data in ${where}: ${error instanceof Error ? error.message : String(error)}`);
  }
  return out;
}
