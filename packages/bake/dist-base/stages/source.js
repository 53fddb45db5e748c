/**
 * Stage 1: decode and sanitise. Produces either an equirectangular RGB image or an RGB cube, with the
 * counts of repaired pixels for the manifest. Policy (recipe.sanitize): NaN -> 0, +Inf and values above
 * maxRadiance -> maxRadiance, -Inf and negatives -> 0, or a typed error when the recipe says 'reject'.
 */
import { CodecError, decodeImage, decodeKtx2, sniffFormat } from '@lightkiln/codecs';
import { LightkilnError, toLightkilnError } from '../errors.js';
import { sharedFloat32, toShared } from '@lightkiln/pool';
import { statSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
function toRgb(image) {
    const n = image.width * image.height;
    if (image.channels === 3)
        return image.data;
    const out = new Float32Array(n * 3);
    const c = image.channels;
    for (let p = 0; p < n; p++) {
        out[p * 3] = image.data[p * c];
        out[p * 3 + 1] = image.data[p * c + (c === 1 ? 0 : 1)];
        out[p * 3 + 2] = image.data[p * c + (c === 1 ? 0 : 2)];
    }
    return out;
}
/** The recipe's input files (bytes given, one path, or six faces), each checked against limits.maxInputBytes. */
export async function readInputFiles(recipe, raw) {
    if (raw.input.bytes !== undefined) {
        if (raw.input.bytes.length > recipe.limits.maxInputBytes)
            throw new LightkilnError('LIMIT_EXCEEDED', `${recipe.input.name}: input of ${raw.input.bytes.length} bytes exceeds limits.maxInputBytes (${recipe.limits.maxInputBytes})`, { file: recipe.input.name });
        return [{ name: recipe.input.name, bytes: raw.input.bytes }];
    }
    const paths = recipe.input.faces ?? [recipe.input.path];
    // Every file is checked before any is read.
    for (const path of paths) {
        let size;
        try {
            const st = statSync(path);
            if (!st.isFile())
                throw new LightkilnError('INVALID_INPUT', `${path}: not a regular file`, { file: path });
            size = st.size;
        }
        catch (error) {
            throw toLightkilnError(error, path);
        }
        if (size > recipe.limits.maxInputBytes)
            throw tooLarge(path, size, recipe.limits.maxInputBytes);
    }
    // Read off this thread (libuv's pool): the pool's workers keep getting tiles meanwhile.
    const files = [];
    for (const path of paths) {
        try {
            const b = await readFile(path);
            // A file that grew after it was checked is held to the same limit.
            if (b.byteLength > recipe.limits.maxInputBytes)
                throw tooLarge(path, b.byteLength, recipe.limits.maxInputBytes);
            files.push({ name: path, bytes: new Uint8Array(b.buffer, b.byteOffset, b.byteLength) });
        }
        catch (error) {
            throw toLightkilnError(error, path);
        }
    }
    return files;
}
const tooLarge = (path, size, limit) => new LightkilnError('LIMIT_EXCEEDED', `${path}: file of ${size} bytes exceeds limits.maxInputBytes (${limit})`, { file: path });
/** Repairs or rejects non-finite, negative and too-bright values in place. */
export function sanitize(data, recipe, file) {
    const counts = { nan: 0, infinite: 0, negative: 0, clampedHigh: 0 };
    const maxR = recipe.sanitize.maxRadiance;
    for (let i = 0; i < data.length; i++) {
        const v = data[i];
        // The common case first: one range test (false for NaN).
        if (v >= 0 && v <= maxR)
            continue;
        if (v !== v) {
            counts.nan++;
            data[i] = 0;
        }
        else if (v === Infinity) {
            counts.infinite++;
            data[i] = maxR;
        }
        else if (v === -Infinity) {
            counts.infinite++;
            data[i] = 0;
        }
        else if (v < 0) {
            counts.negative++;
            data[i] = 0;
        }
        else if (v > maxR) {
            counts.clampedHigh++;
            data[i] = maxR;
        }
    }
    if (recipe.sanitize.nonFinite === 'reject' && counts.nan + counts.infinite > 0) {
        throw new LightkilnError('INVALID_INPUT', `${file}: ${counts.nan} NaN and ${counts.infinite} infinite values (sanitize.nonFinite is 'reject')`, { file });
    }
    if (recipe.sanitize.negative === 'reject' && counts.negative > 0) {
        throw new LightkilnError('INVALID_INPUT', `${file}: ${counts.negative} negative values (sanitize.negative is 'reject')`, { file });
    }
    return counts;
}
const limitsFor = (recipe) => ({ maxPixels: recipe.limits.maxInputPixels, maxBytes: recipe.limits.maxInputBytes });
/** Decodes the input(s) of a recipe into a sanitised source. */
export function decodeSource(recipe, inputs) {
    try {
        if (inputs.length === 6)
            return decodeFaces(recipe, inputs);
        const input = inputs[0];
        const format = sniffFormat(input.bytes);
        if (format === 'ktx2' || recipe.input.layout === 'cube') {
            if (format !== 'ktx2')
                throw new LightkilnError('INVALID_INPUT', `${input.name}: layout 'cube' needs a KTX 2.0 cubemap (six faces go in input.faces)`, { file: input.name });
            const ktx = decodeKtx2(input.bytes, { file: input.name, limits: limitsFor(recipe) });
            if (ktx.faceCount !== 6)
                throw new LightkilnError('INVALID_INPUT', `${input.name}: KTX 2.0 input must be a cubemap (faceCount 6), got ${ktx.faceCount}`, { file: input.name });
            if (ktx.channels < 3)
                throw new LightkilnError('INVALID_INPUT', `${input.name}: KTX 2.0 input must have RGB channels`, { file: input.name });
            const level = ktx.levels[0];
            const n = ktx.width * ktx.width * 6;
            const data = sharedFloat32(n * 3);
            for (let t = 0; t < n; t++)
                for (let c = 0; c < 3; c++)
                    data[t * 3 + c] = level.data[t * ktx.channels + c];
            return { kind: 'cube', size: ktx.width, data, sanitized: sanitize(data, recipe, input.name) };
        }
        const image = decodeImage(input.bytes, { file: input.name, limits: limitsFor(recipe) });
        if (image.width < 4 || image.height < 2)
            throw new LightkilnError('INVALID_INPUT', `${input.name}: equirectangular image of ${image.width} x ${image.height} is too small (at least 4 x 2)`, { file: input.name });
        // Shared memory from the start: the pool's kernels read it without a second copy of the image.
        const data = toShared(toRgb(image));
        return { kind: 'equirect', width: image.width, height: image.height, data, sanitized: sanitize(data, recipe, input.name) };
    }
    catch (error) {
        if (error instanceof CodecError || !(error instanceof LightkilnError))
            throw toLightkilnError(error);
        throw error;
    }
}
function decodeFaces(recipe, inputs) {
    let size = 0;
    let data = null;
    const total = { nan: 0, infinite: 0, negative: 0, clampedHigh: 0 };
    inputs.forEach((input, face) => {
        const image = decodeImage(input.bytes, { file: input.name, limits: limitsFor(recipe) });
        if (image.width !== image.height)
            throw new LightkilnError('INVALID_INPUT', `${input.name}: cube face must be square, got ${image.width} x ${image.height}`, { file: input.name });
        if (face === 0) {
            size = image.width;
            data = sharedFloat32(size * size * 6 * 3);
        }
        else if (image.width !== size) {
            throw new LightkilnError('INVALID_INPUT', `${input.name}: face size ${image.width} differs from the first face (${size})`, { file: input.name });
        }
        const rgb = toRgb(image);
        const counts = sanitize(rgb, recipe, input.name);
        total.nan += counts.nan;
        total.infinite += counts.infinite;
        total.negative += counts.negative;
        total.clampedHigh += counts.clampedHigh;
        data.set(rgb, face * size * size * 3);
    });
    return { kind: 'cube', size, data: data, sanitized: total };
}
//# sourceMappingURL=source.js.map