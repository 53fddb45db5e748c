/**
 * Shared inline helpers of the kernels: cube texel layout and bilinear fetches. A cube level of face
 * size n is 6 n^2 RGB float32 texels, face-major, rows top (t = 0) first: ((face n + y) n + x) 3.
 */
import { CUBE_FACE_BASIS, directionToCubeFace } from '@lightkiln/math';
/**
 * Bilinear fetch from one face of a cube level at face coordinates (s, t) in [0, 1], clamped to the face
 * edges (no filtering across faces). Adds weight * colour to acc[0..2].
 */
export function fetchFaceBilinear(acc, cube, levelOffset, size, face, s, t, weight) {
    let fx = s * size - 0.5;
    let fy = t * size - 0.5;
    const max = size - 1;
    if (fx < 0)
        fx = 0;
    else if (fx > max)
        fx = max;
    if (fy < 0)
        fy = 0;
    else if (fy > max)
        fy = max;
    const x0 = fx | 0;
    const y0 = fy | 0;
    const x1 = x0 < max ? x0 + 1 : max;
    const y1 = y0 < max ? y0 + 1 : max;
    const ax = fx - x0;
    const ay = fy - y0;
    const base = levelOffset + face * size * size * 3;
    const i00 = base + (y0 * size + x0) * 3;
    const i10 = base + (y0 * size + x1) * 3;
    const i01 = base + (y1 * size + x0) * 3;
    const i11 = base + (y1 * size + x1) * 3;
    const w00 = (1 - ax) * (1 - ay) * weight;
    const w10 = ax * (1 - ay) * weight;
    const w01 = (1 - ax) * ay * weight;
    const w11 = ax * ay * weight;
    acc[0] = acc[0] + cube[i00] * w00 + cube[i10] * w10 + cube[i01] * w01 + cube[i11] * w11;
    acc[1] = acc[1] + cube[i00 + 1] * w00 + cube[i10 + 1] * w10 + cube[i01 + 1] * w01 + cube[i11 + 1] * w11;
    acc[2] = acc[2] + cube[i00 + 2] * w00 + cube[i10 + 2] * w10 + cube[i01 + 2] * w01 + cube[i11 + 2] * w11;
}
/**
 * The texel a bilinear tap (face, x, y) of a level of face size n reads when x or y lies one past the
 * face: the tap's texel centre on the face's extended plane, then the face that direction selects (the
 * Vulkan specification's cube-map edge handling); returns the float index of the texel's red channel.
 */
const wrapSelection = new Float64Array(3);
function wrappedTap(levelOffset, n, face, x, y) {
    const u = (2 * (x + 0.5)) / n - 1;
    const v = (2 * (y + 0.5)) / n - 1;
    const b = face * 9;
    const B = CUBE_FACE_BASIS;
    // The slow path (half a texel from an edge): math's face selection, same table and ties as the kernels.
    directionToCubeFace(wrapSelection, 0, B[b] + u * B[b + 3] + v * B[b + 6], B[b + 1] + u * B[b + 4] + v * B[b + 7], B[b + 2] + u * B[b + 5] + v * B[b + 8]);
    const f = wrapSelection[0];
    let tx = Math.floor(wrapSelection[1] * n);
    let ty = Math.floor(wrapSelection[2] * n);
    if (tx < 0)
        tx = 0;
    else if (tx > n - 1)
        tx = n - 1;
    if (ty < 0)
        ty = 0;
    else if (ty > n - 1)
        ty = n - 1;
    return levelOffset + ((f * n + ty) * n + tx) * 3;
}
/** Adds weight * texel (face, x, y) to acc, x and y up to one past the face; a corner tap averages the three texels that meet there. */
function addTap(acc, cube, levelOffset, n, face, x, y, weight) {
    const inX = x >= 0 && x < n;
    const inY = y >= 0 && y < n;
    if (inX && inY) {
        const i = levelOffset + ((face * n + y) * n + x) * 3;
        acc[0] = acc[0] + cube[i] * weight;
        acc[1] = acc[1] + cube[i + 1] * weight;
        acc[2] = acc[2] + cube[i + 2] * weight;
        return;
    }
    if (!inX && !inY) {
        const cx = x < 0 ? 0 : n - 1;
        const cy = y < 0 ? 0 : n - 1;
        const w3 = weight / 3;
        const a = levelOffset + ((face * n + cy) * n + cx) * 3;
        const b = wrappedTap(levelOffset, n, face, x, cy);
        const c = wrappedTap(levelOffset, n, face, cx, y);
        for (let k = 0; k < 3; k++)
            acc[k] = acc[k] + (cube[a + k] + cube[b + k] + cube[c + k]) * w3;
        return;
    }
    const i = wrappedTap(levelOffset, n, face, x, y);
    acc[0] = acc[0] + cube[i] * weight;
    acc[1] = acc[1] + cube[i + 1] * weight;
    acc[2] = acc[2] + cube[i + 2] * weight;
}
/**
 * Seamless bilinear fetch (taps past a face edge read the neighbouring face, corners average three
 * texels) at unclamped texel coordinates fx = s n - 0.5, fy = t n - 0.5; adds weight * colour to acc.
 * The kernels call it only within half a texel of an edge, where the clamped fetch would be wrong.
 */
export function fetchSeamlessBilinear(acc, cube, levelOffset, n, face, fx, fy, weight) {
    const x0 = Math.floor(fx);
    const y0 = Math.floor(fy);
    const ax = fx - x0;
    const ay = fy - y0;
    addTap(acc, cube, levelOffset, n, face, x0, y0, (1 - ax) * (1 - ay) * weight);
    addTap(acc, cube, levelOffset, n, face, x0 + 1, y0, ax * (1 - ay) * weight);
    addTap(acc, cube, levelOffset, n, face, x0, y0 + 1, (1 - ax) * ay * weight);
    addTap(acc, cube, levelOffset, n, face, x0 + 1, y0 + 1, ax * ay * weight);
}
//# sourceMappingURL=cube-fetch.js.map