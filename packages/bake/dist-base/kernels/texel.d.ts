/** Texel addressing shared by the kernels (called once per texel, never per sample). */
/**
 * Unit direction through the centre of output item `local` of a cube level of face size `size`
 * (faces one after another, rows top first), from the inverse selection table (Vulkan spec, "Cube Map
 * Face Selection"); written to out[0..2].
 */
export declare function texelCentreDirection(out: Float64Array, local: number, size: number): void;
//# sourceMappingURL=texel.d.ts.map