/** Texel addressing shared by the kernels (called once per texel, never per sample). */
/**
 * Unit direction through the centre of output item `local` of a cube level of face size `size`
 * (faces one after another, rows top first), from the inverse selection table (Vulkan spec, "Cube Map
 * Face Selection"); written to out[0..2].
 */
export function texelCentreDirection(out, local, size) {
    const perFace = size * size;
    const face = (local / perFace) | 0;
    const rem = local - face * perFace;
    const ty = (rem / size) | 0;
    const tx = rem - ty * size;
    const u = (2 * (tx + 0.5)) / size - 1;
    const v = (2 * (ty + 0.5)) / size - 1;
    let x;
    let y;
    let z;
    switch (face) {
        case 0:
            x = 1;
            y = -v;
            z = -u;
            break;
        case 1:
            x = -1;
            y = -v;
            z = u;
            break;
        case 2:
            x = u;
            y = 1;
            z = v;
            break;
        case 3:
            x = u;
            y = -1;
            z = -v;
            break;
        case 4:
            x = u;
            y = -v;
            z = 1;
            break;
        default:
            x = -u;
            y = -v;
            z = -1;
            break;
    }
    const inv = 1 / Math.sqrt(x * x + y * y + z * z);
    out[0] = x * inv;
    out[1] = y * inv;
    out[2] = z * inv;
}
//# sourceMappingURL=texel.js.map