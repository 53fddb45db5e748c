/**
 * Shared inline helpers of the kernels: cube texel layout and bilinear fetches. A cube level of face
 * size n is 6 n^2 RGB float32 texels, face-major, rows top (t = 0) first: ((face n + y) n + x) 3.
 */
/**
 * Bilinear fetch from one face of a cube level at face coordinates (s, t) in [0, 1], clamped to the face
 * edges (no filtering across faces). Adds weight * colour to acc[0..2].
 */
export declare function fetchFaceBilinear(acc: Float64Array, cube: Float32Array, levelOffset: number, size: number, face: number, s: number, t: number, weight: number): void;
/**
 * Seamless bilinear fetch (taps past a face edge read the neighbouring face, corners average three
 * texels) at unclamped texel coordinates fx = s n - 0.5, fy = t n - 0.5; adds weight * colour to acc.
 * The kernels call it only within half a texel of an edge, where the clamped fetch would be wrong.
 */
export declare function fetchSeamlessBilinear(acc: Float64Array, cube: Float32Array, levelOffset: number, n: number, face: number, fx: number, fy: number, weight: number): void;
//# sourceMappingURL=cube-fetch.d.ts.map