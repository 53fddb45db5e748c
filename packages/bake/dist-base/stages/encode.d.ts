/** Stage 7: GPU files (KTX 2.0) and inspection views of the baked data. */
import { type FloatImage } from '@lightkiln/codecs';
import type { CubeFormat } from '../recipe.js';
import type { DfgTable } from './dfg.js';
export declare const WRITER = "lightkiln 0.1.0";
/**
 * Largest finite value of each channel a cube format stores (IEEE 754 binary16: 65504; RGB9E5: 65408;
 * B10G11R11: 65024 for the 11-bit R and G, 64512 for the 10-bit B; float32: 3.4028235e38).
 */
export declare const FORMAT_MAX: Readonly<Record<CubeFormat, readonly [number, number, number]>>;
/**
 * A cube (all levels) as KTX 2.0, and how many texels were clamped to the format's range (each level is
 * packed from its RGB floats straight into the format: alpha 1, channels clamped to FORMAT_MAX so no
 * artifact holds Inf).
 */
export declare function encodeCubeKtx2(levels: readonly Float32Array[], size: number, format: CubeFormat, supercompression: 'none' | 'zlib' | 'zstd', keyValues: Record<string, string>): {
    bytes: Uint8Array;
    clamped: number;
};
export declare function encodeDfgKtx2(table: DfgTable, supercompression: 'none' | 'zlib' | 'zstd', samples: number): Uint8Array;
/**
 * Unfolds the six faces of a cube level into a 4N x 3N horizontal cross (+Y above +Z, -Y below;
 * -X, +Z, +X, -Z across), each face as stored (row 0 at the top), for inspection only.
 */
export declare function cubeCross(rgb: Float32Array, size: number): FloatImage;
//# sourceMappingURL=encode.d.ts.map