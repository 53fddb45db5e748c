/**
 * Loading lightkiln's KTX 2.0 files into three.js textures (browser module).
 *
 * three's KTX2Loader reads our uncompressed float files (rgba16f, rgba32f, rg16f; no supercompression or
 * Zstandard, scheme 2) but returns a cubemap as a 2D DataTexture whose mip data holds all six faces one
 * after another: `cubeTextureFromKtx2` cuts each level into its faces and builds a CubeTexture with the
 * whole mip chain, sampled with trilinear filtering (WebGL 2 cube maps are always seamless).
 */

import * as THREE from 'three';
import { KTX2Loader } from 'three/addons/loaders/KTX2Loader.js';

/** three's KTX 2.0 loader, told what the renderer supports (it asks even for uncompressed files). */
export function createKtx2Loader(renderer) {
  return new KTX2Loader().detectSupport(renderer);
}

/** Fetches and parses one KTX 2.0 file: three's DataTexture, its mip list holding every face of each level. */
export async function loadKtx2(loader, url) {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`${url}: HTTP ${response.status}`);
  const buffer = await response.arrayBuffer();
  return new Promise((resolve, reject) => loader.parse(buffer, resolve, reject));
}

/** A CubeTexture from a loaded KTX 2.0 cubemap (faces +X, -X, +Y, -Y, +Z, -Z in each level, as stored). */
export function cubeTextureFromKtx2(loaded) {
  const levels = loaded.mipmaps;
  const faceOf = (level, face) => {
    const perFace = level.data.length / 6;
    const image = { data: level.data.subarray(face * perFace, (face + 1) * perFace), width: level.width, height: level.height };
    const texture = new THREE.DataTexture(image.data, image.width, image.height, loaded.format, loaded.type);
    texture.image = image;
    return texture;
  };
  const faces = [0, 1, 2, 3, 4, 5].map((f) => faceOf(levels[0], f));
  const cube = new THREE.CubeTexture(faces, THREE.CubeReflectionMapping, THREE.ClampToEdgeWrapping, THREE.ClampToEdgeWrapping,
    THREE.LinearFilter, levels.length > 1 ? THREE.LinearMipmapLinearFilter : THREE.LinearFilter, loaded.format, loaded.type);
  // three reads a cube's mips from texture.mipmaps[j].image[face] (level j + 1).
  cube.mipmaps = levels.slice(1).map((level) => ({ image: [0, 1, 2, 3, 4, 5].map((f) => faceOf(level, f)) }));
  return asStored(cube);
}

/** Texels used as stored: no generated mips, no flip, linear values (no colour-space conversion). */
function asStored(texture) {
  texture.generateMipmaps = false;
  texture.flipY = false;
  texture.colorSpace = THREE.NoColorSpace;
  texture.needsUpdate = true;
  return texture;
}

/** The 2D DFG table as loaded (A in red, B in green), filtered linearly and clamped at its edges. */
export function dfgTextureFromKtx2(loaded) {
  const level = loaded.mipmaps[0];
  const texture = new THREE.DataTexture(level.data, level.width, level.height, loaded.format, loaded.type);
  texture.minFilter = THREE.LinearFilter;
  texture.magFilter = THREE.LinearFilter;
  texture.wrapS = THREE.ClampToEdgeWrapping;
  texture.wrapT = THREE.ClampToEdgeWrapping;
  return asStored(texture);
}

/**
 * The manifest's roughness-to-LOD mapping "lod = (L - 1) * pow(r, E), L = N" as the two numbers a shader
 * needs: lod = scale * pow(r, power).
 */
export function parseRoughnessToLod(formula) {
  const m = /^lod = \(L - 1\) \* pow\(r, ([0-9.]+)\), L = (\d+)$/.exec(formula);
  if (m === null) throw new Error(`unexpected roughnessToLod "${formula}"`);
  return { scale: Number(m[2]) - 1, power: Number(m[1]) };
}
