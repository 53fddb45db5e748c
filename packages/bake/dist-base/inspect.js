/** Readable summaries of every file lightkiln reads or writes (for `lightkiln inspect`). */
import { decodeImage, decodeKtx2, readExrHeader, readHdrHeader, sniffFormat } from '@lightkiln/codecs';
import { luminance } from '@lightkiln/math';
import { LightkilnError, toLightkilnError } from './errors.js';
function range(data, channels) {
    let min = Infinity;
    let max = -Infinity;
    let sumY = 0;
    const n = data.length / channels;
    for (let t = 0; t < n; t++) {
        for (let c = 0; c < Math.min(3, channels); c++) {
            const v = data[t * channels + c];
            if (v < min)
                min = v;
            if (v > max)
                max = v;
        }
        sumY += channels >= 3 ? luminance(data[t * channels], data[t * channels + 1], data[t * channels + 2]) : data[t * channels];
    }
    return { min, max, meanLuminance: n > 0 ? sumY / n : 0 };
}
const DF_MODELS = { 1: 'RGBSDA' };
const DF_TRANSFER = { 1: 'linear', 2: 'sRGB' };
const DF_PRIMARIES = { 1: 'BT.709' };
/** Summarises a file by its signature (KTX 2.0, .hdr, .exr, .pfm, PNG, or a lightkiln manifest). */
export function inspectBytes(bytes, file) {
    try {
        const format = sniffFormat(bytes);
        if (format === 'ktx2') {
            const ktx = decodeKtx2(bytes, { file });
            const kv = Object.fromEntries(ktx.keyValues);
            let roughness = null;
            try {
                roughness = kv['lightkiln.roughness'] !== undefined ? JSON.parse(kv['lightkiln.roughness']) : null;
            }
            catch {
                roughness = null;
            }
            const dfd = ktx.dfd;
            const sampleCount = (dfd.length - 7) / 4;
            return {
                file, format: 'ktx2', byteLength: bytes.length,
                details: {
                    vkFormat: `${ktx.vkName} (${ktx.vkFormat})`,
                    size: `${ktx.width} x ${ktx.height}`,
                    faces: ktx.faceCount,
                    supercompression: ktx.supercompression,
                    levels: ktx.levels.map((level, m) => ({
                        level: m, size: `${level.width} x ${level.height}`, byteLength: level.byteLength,
                        ...(roughness?.[m] !== undefined ? { roughness: roughness[m] } : {}),
                        ...range(level.data, ktx.channels),
                    })),
                    dataFormatDescriptor: {
                        totalBytes: dfd[0], colorModel: DF_MODELS[dfd[3] & 0xff] ?? String(dfd[3] & 0xff),
                        primaries: DF_PRIMARIES[(dfd[3] >> 8) & 0xff] ?? String((dfd[3] >> 8) & 0xff),
                        transfer: DF_TRANSFER[(dfd[3] >> 16) & 0xff] ?? String((dfd[3] >> 16) & 0xff),
                        bytesPlane0: dfd[5] & 0xff, samples: sampleCount,
                    },
                    metadata: kv,
                },
            };
        }
        if (format === 'hdr' || format === 'exr' || format === 'pfm') {
            const image = decodeImage(bytes, { file });
            const header = format === 'hdr' ? readHdrHeader(bytes, file) : null;
            const exr = format === 'exr' ? readExrHeader(bytes, file) : null;
            return {
                file, format, byteLength: bytes.length,
                details: {
                    size: `${image.width} x ${image.height}`, channels: image.channels,
                    ...(header ? { programType: header.programType, resolution: header.resolution, exposure: header.exposure } : {}),
                    ...(exr ? { exrChannels: exr.channels.map((c) => `${c.name}:${['uint', 'half', 'float'][c.pixelType]}`), compression: exr.compression } : {}),
                    ...range(image.data, image.channels),
                    nonFinite: image.issues.nan + image.issues.infinite, negative: image.issues.negative,
                },
            };
        }
        if (format === 'png') {
            if (bytes.length < 33)
                throw new LightkilnError('INVALID_INPUT', `${file}: PNG file is truncated`, { file });
            const v = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
            return { file, format: 'png', byteLength: bytes.length, details: { size: `${v.getUint32(16)} x ${v.getUint32(20)}`, bitDepth: bytes[24], colourType: bytes[25] } };
        }
        const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes.subarray(0, Math.min(bytes.length, 64)));
        if (text.trimStart().startsWith('{')) {
            let manifest;
            try {
                manifest = JSON.parse(new TextDecoder().decode(bytes));
            }
            catch (error) {
                throw new LightkilnError('INVALID_INPUT', `${file}: not valid JSON`, { file, cause: error });
            }
            if (manifest.tool === undefined || manifest.schemaVersion === undefined)
                throw new LightkilnError('UNSUPPORTED_FORMAT', `${file}: JSON but not a lightkiln manifest`, { file });
            return {
                file, format: 'manifest', byteLength: bytes.length,
                details: { probe: manifest.probe, tool: manifest.tool, inputs: manifest.inputs, levels: manifest.levels, sh: manifest.sh, artifacts: manifest.artifacts, sanitized: manifest.sanitized },
            };
        }
        throw new LightkilnError('UNSUPPORTED_FORMAT', `${file}: unknown file type (expected KTX 2.0, .hdr, .exr, .pfm, PNG or a lightkiln manifest)`, { file });
    }
    catch (error) {
        throw toLightkilnError(error, file);
    }
}
//# sourceMappingURL=inspect.js.map