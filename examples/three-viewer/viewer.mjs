/**
 * The page's script: loads a probe's manifest and its three KTX 2.0 files, draws the sphere grid with
 * the split-sum shader, and exposes the rendered pixels as `window.lightkilnViewer` (for the test).
 * Query: ?probe=NAME (files under /assets/), optional &exposure=X (else the contact sheet's automatic
 * exposure: log-average luminance of level 0 to 0.18, Reinhard et al. 2002, eq. 1).
 */

import * as THREE from 'three';
import { createKtx2Loader, cubeTextureFromKtx2, dfgTextureFromKtx2, loadKtx2, parseRoughnessToLod } from './cube-from-ktx2.mjs';
import { fragmentShader, vertexShader } from './split-sum.glsl.mjs';

const SPHERE = 96;

function levelZeroExposure(loaded) {
  const level = loaded.mipmaps[0];
  const channels = loaded.format === THREE.RGBAFormat ? 4 : 3;
  const read = loaded.type === THREE.HalfFloatType ? (i) => THREE.DataUtils.fromHalfFloat(level.data[i]) : (i) => level.data[i];
  const count = level.data.length / channels;
  let logSum = 0;
  for (let t = 0; t < count; t++) {
    const y = 0.2126 * read(t * channels) + 0.7152 * read(t * channels + 1) + 0.0722 * read(t * channels + 2);
    logSum += Math.log(1e-4 + y);
  }
  return 0.18 / Math.exp(logSum / count);
}

async function main() {
  const query = new URLSearchParams(location.search);
  const probe = query.get('probe') ?? 'observatory-dusk';
  const manifest = await (await fetch(`/assets/${probe}.probe.json`)).json();
  const width = 5 * SPHERE;
  const height = 2 * SPHERE;
  const renderer = new THREE.WebGLRenderer({ antialias: false, preserveDrawingBuffer: true });
  renderer.setPixelRatio(1);
  renderer.setSize(width, height);
  document.body.appendChild(renderer.domElement);
  const loader = createKtx2Loader(renderer);
  const file = (kind) => manifest.artifacts.find((a) => a.kind === kind).path;
  const [specular, irradiance, dfg] = await Promise.all([file('specular'), file('irradiance'), file('lut')].map((p) => loadKtx2(loader, `/assets/${p}`)));
  const exposure = query.has('exposure') ? Number(query.get('exposure')) : levelZeroExposure(specular);
  const lod = parseRoughnessToLod(manifest.roughnessToLod);
  const material = new THREE.RawShaderMaterial({
    glslVersion: THREE.GLSL3,
    vertexShader,
    fragmentShader,
    uniforms: {
      specularCube: { value: cubeTextureFromKtx2(specular) },
      irradianceCube: { value: cubeTextureFromKtx2(irradiance) },
      dfgTable: { value: dfgTextureFromKtx2(dfg) },
      lodScale: { value: lod.scale },
      lodPower: { value: lod.power },
      exposure: { value: exposure },
      sphereSize: { value: SPHERE },
      canvasSize: { value: new THREE.Vector2(width, height) },
    },
  });
  const scene = new THREE.Scene();
  scene.add(new THREE.Mesh(new THREE.PlaneGeometry(2, 2), material));
  renderer.render(scene, new THREE.Camera());

  const gl = renderer.getContext();
  const bottomUp = new Uint8Array(width * height * 4);
  gl.readPixels(0, 0, width, height, gl.RGBA, gl.UNSIGNED_BYTE, bottomUp);
  const rgb = new Array(width * height * 3);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const src = ((height - 1 - y) * width + x) * 4;
      const dst = (y * width + x) * 3;
      rgb[dst] = bottomUp[src]; rgb[dst + 1] = bottomUp[src + 1]; rgb[dst + 2] = bottomUp[src + 2];
    }
  }
  window.lightkilnViewer = { width, height, sphere: SPHERE, exposure, rgb, glError: gl.getError(), renderer: gl.getParameter(gl.RENDERER) };
}

main().catch((error) => {
  window.lightkilnViewer = { error: String(error && error.stack ? error.stack : error) };
});
