/** EXR decode memory limit. */
import { describe, expect, it } from 'vitest';
import { decodeExr } from '@lightkiln/codecs';

describe('EXR decode memory (computed from the header before any allocation)', () => {
  // A 1 MB-class header with 2000 FLOAT channels over 8192 x 16 pixels, ZIP (16-line chunks): one chunk
  // of every channel is 1 GiB. OpenEXR header layout from the OpenEXR file layout specification.
  function manyChannelHeader(channels: number, width: number, height: number): Uint8Array {
    const parts: number[] = [];
    const u8 = (v: number): void => { parts.push(v & 0xff); };
    const i32 = (v: number): void => { for (let k = 0; k < 4; k++) u8(v >>> (8 * k)); };
    const str = (s: string): void => { for (const c of s) u8(c.charCodeAt(0)); u8(0); };
    i32(20000630); i32(2);
    const chl: number[] = [];
    for (let c = 0; c < channels; c++) {
      for (const ch of `c${c}`) chl.push(ch.charCodeAt(0));
      chl.push(0, 2, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 0);
    }
    for (const ch of 'R') chl.push(ch.charCodeAt(0));
    chl.push(0, 2, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 0);
    chl.push(0);
    str('channels'); str('chlist'); i32(chl.length); parts.push(...chl);
    str('compression'); str('compression'); i32(1); u8(3);
    str('dataWindow'); str('box2i'); i32(16); i32(0); i32(0); i32(width - 1); i32(height - 1);
    str('lineOrder'); str('lineOrder'); i32(1); u8(0);
    u8(0);
    return Uint8Array.from(parts);
  }

  it('refuses a file whose chunks would need more memory than the limit, naming the file', () => {
    const bytes = manyChannelHeader(2000, 8192, 16);
    expect(() => decodeExr(bytes, { file: 'many.exr' })).toThrow(/many\.exr.*MiB/);
    try {
      decodeExr(bytes, { file: 'many.exr' });
    } catch (error) {
      expect((error as { code: string }).code).toBe('LIMIT_EXCEEDED');
    }
  });
});
