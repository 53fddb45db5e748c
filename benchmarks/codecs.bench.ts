/** Codec throughput on a 4096 x 2048 RGB image: decode and encode, MB/s of file and Mpixel/s. */

import { decodeExr, decodeHdr, decodeKtx2, decodePfm, encodeExr, encodeHdr, encodeKtx2, encodePfm, encodePng, toneMapToSrgb8 } from '@lightkiln/codecs';
import { record, runBench, syntheticSky } from './common.js';

export async function codecsBench(): Promise<void> {
  const width = 4096;
  const height = 2048;
  const image = { width, height, channels: 3, data: syntheticSky(width, height) };
  const mpix = (width * height) / 1e6;
  const hdr = encodeHdr(image);
  const exrZip = encodeExr(image, { compression: 'zip', pixelType: 'half' });
  const exrNone = encodeExr(image, { compression: 'none', pixelType: 'float' });
  const pfm = encodePfm(image);
  const png8 = toneMapToSrgb8(image);
  const rgba = new Float32Array(width * height * 4);
  for (let p = 0; p < width * height; p++) { rgba[p * 4] = image.data[p * 3]!; rgba[p * 4 + 1] = image.data[p * 3 + 1]!; rgba[p * 4 + 2] = image.data[p * 3 + 2]!; rgba[p * 4 + 3] = 1; }
  const ktx = encodeKtx2({ format: 'rgba16f', width, height, faceCount: 1, levels: [rgba] });
  const sizes: Record<string, number> = { hdr: hdr.length, 'exr zip half': exrZip.length, 'exr none float': exrNone.length, pfm: pfm.length, ktx2: ktx.length };
  const decode = await runBench('decode 4096 x 2048', {
    hdr: () => decodeHdr(hdr), 'exr zip half': () => decodeExr(exrZip), 'exr none float': () => decodeExr(exrNone), pfm: () => decodePfm(pfm), ktx2: () => decodeKtx2(ktx),
  }, { iterations: 5 });
  for (const [name, r] of Object.entries(decode)) {
    record(`decode ${name}`, mpix / (r.medianMs / 1000), 'Mpixel/s', `${(sizes[name]! / 1e6 / (r.medianMs / 1000)).toFixed(1)} MB/s of file`);
  }
  const encode = await runBench('encode 4096 x 2048', {
    hdr: () => encodeHdr(image), 'exr zip half': () => encodeExr(image, { compression: 'zip', pixelType: 'half' }),
    'exr none float': () => encodeExr(image, { compression: 'none', pixelType: 'float' }), pfm: () => encodePfm(image),
    ktx2: () => encodeKtx2({ format: 'rgba16f', width, height, faceCount: 1, levels: [rgba] }), 'png (8-bit preview)': () => encodePng(png8),
  }, { iterations: 3 });
  for (const [name, r] of Object.entries(encode)) {
    const size = sizes[name];
    record(`encode ${name}`, mpix / (r.medianMs / 1000), 'Mpixel/s', size === undefined ? '' : `${(size / 1e6 / (r.medianMs / 1000)).toFixed(1)} MB/s of file`);
  }
}
