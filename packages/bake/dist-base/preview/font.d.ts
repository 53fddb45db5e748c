/**
 * A tiny 5 x 7 bitmap font of our own drawing for preview labels: upper-case letters, digits and a few
 * signs. Each glyph is seven rows of five characters, '#' for ink.
 */
/** Draws `text` (upper-cased) into an RGB8 canvas at (x, y) with pixel scale `scale`. */
export declare function drawText(canvas: Uint8Array, width: number, height: number, text: string, x: number, y: number, scale: number, rgb: readonly [number, number, number]): void;
/** Width in pixels of a label at a scale. */
export declare function textWidth(text: string, scale: number): number;
//# sourceMappingURL=font.d.ts.map