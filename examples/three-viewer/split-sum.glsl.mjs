/**
 * The split-sum image-based lighting shader for lightkiln's assets (GLSL ES 3.00 under THREE.GLSL3, three.js
 * RawShaderMaterial): specular = LD(r, lod(roughness)) * (F0 * A + f90 * B) with A, B from the DFG table
 * at (n.v, roughness) (Karis 2013, "Real Shading in Unreal Engine 4"), diffuse = albedo * (1 - F) * E / pi
 * from the irradiance cube. Here the page is a 5 x 2 grid of spheres seen from +Z (orthographic, v = +Z):
 * roughness 0, 0.25, 0.5, 0.75, 1 across; a grey dielectric (F0 0.04, albedo 0.5) above a copper-like
 * metal (F0 0.95, 0.64, 0.54). Output: exposure, Reinhard c / (1 + c) (Reinhard et al. 2002, eq. 3),
 * sRGB encoding (IEC 61966-2-1), so the picture matches the contact sheet lightkiln writes.
 */

export const vertexShader = /* glsl */ `
in vec3 position;
void main() {
  gl_Position = vec4(position.xy, 0.0, 1.0);
}
`;

export const fragmentShader = /* glsl */ `
precision highp float;
uniform samplerCube specularCube;
uniform samplerCube irradianceCube;
uniform sampler2D dfgTable;
// The manifest's roughnessToLod: lod = lodScale * pow(r, lodPower), lodScale = L - 1.
uniform float lodScale;
uniform float lodPower;
uniform float exposure;
uniform float sphereSize;
uniform vec2 canvasSize;
out vec4 colour;

const float PI = 3.14159265358979;

vec3 srgbEncode(vec3 c) {
  return mix(12.92 * c, 1.055 * pow(c, vec3(1.0 / 2.4)) - 0.055, step(vec3(0.0031308), c));
}

void main() {
  // Pixel position from the top-left corner (pixel centres at + 0.5).
  vec2 p = vec2(gl_FragCoord.x, canvasSize.y - gl_FragCoord.y);
  vec2 cell = floor(p / sphereSize);
  float radius = 0.5 * sphereSize;
  vec2 q = (p - cell * sphereSize - radius) / radius;
  float nz2 = 1.0 - dot(q, q);
  if (nz2 <= 0.0) {
    colour = vec4(24.0, 24.0, 28.0, 255.0) / 255.0;
    return;
  }
  vec3 n = vec3(q.x, -q.y, sqrt(nz2));
  float roughness = 0.25 * cell.x;
  bool metal = cell.y > 0.5;
  vec3 f0 = metal ? vec3(0.95, 0.64, 0.54) : vec3(0.04);
  float albedo = metal ? 0.0 : 0.5;
  // v = +Z: mirror direction 2 (n.v) n - v, and n.v = n.z.
  vec3 r = vec3(2.0 * n.z * n.x, 2.0 * n.z * n.y, 2.0 * n.z * n.z - 1.0);
  float lod = lodScale * pow(roughness, lodPower);
  vec3 ld = textureLod(specularCube, r, lod).rgb;
  vec2 ab = texture(dfgTable, vec2(n.z, roughness)).rg;
  vec3 e = texture(irradianceCube, n).rgb;
  vec3 spec = f0 * ab.x + ab.y;
  vec3 c = ld * spec + albedo * (1.0 - spec) * e / PI;
  vec3 v = max(c * exposure, 0.0);
  colour = vec4(srgbEncode(v / (1.0 + v)), 1.0);
}
`;
