/**
 * Per-bake node table of the hierarchical quadrature: for every pyramid texel of every level, the world-frame
 * data the tree walk reads, packed so one node is one run of NODE_TABLE_STRIDE float32 (44 bytes):
 * unit geometric mean direction (3), RGB mean radiance (3), luminance (Rec. 709 weights, ITU-R BT.709-6),
 * and the luminance-weighted mean direction vector as unit direction (3) and length (1: 1 for a point
 * light, less when spread; -1 marks uniform light, whose weight is the geometry's).
 * Built once per bake from the pyramid, the node geometry table and the centroid offsets, so the walk
 * does no face-frame rotations. Float32 keeps 1 - n.l accurate to about 1e-7, far below the alpha^2 of
 * any level the bake makes.
 */

import { CUBE_FACE_BASIS } from '@lightkiln/math';
import type { SharedBuffers } from '@lightkiln/pool';
import { NODE_STRIDE } from '../stages/node-geometry.js';

export const NODE_TABLE_STRIDE = 11;

export interface NodeTableParams {
  /** Face size of the level, its first texel (pyramid texel index), its first node in the table, and its geometry table float offset. */
  readonly size: number;
  readonly firstTexel: number;
  readonly nodeOffset: number;
  readonly geometryOffset: number;
}

/**
 * Items are texels of one level, faces one after another. buffers.pyramid (RGB float64),
 * buffers.centroids (float32, face frame offsets), buffers.geometry (node geometry of one face),
 * buffers.nodes (float32 out).
 */
export function buildNodeTable(buffers: SharedBuffers, begin: number, end: number, params: NodeTableParams): void {
  const pyr = buffers.pyramid as Float32Array;
  const cent = buffers.centroids as Float32Array;
  const geo = buffers.geometry as Float64Array;
  const nodes = buffers.nodes as Float32Array;
  const B = CUBE_FACE_BASIS;
  const perFace = params.size * params.size;
  for (let item = begin; item < end; item++) {
    const face = (item / perFace) | 0;
    const gi = params.geometryOffset + (item - face * perFace) * NODE_STRIDE;
    const b = face * 9;
    const mc = geo[gi]!;
    const mu = geo[gi + 1]!;
    const mv = geo[gi + 2]!;
    const inv = 1 / geo[gi + 7]!;
    const t = params.firstTexel + item;
    const o = (params.nodeOffset + item) * NODE_TABLE_STRIDE;
    nodes[o] = (B[b]! * mc + B[b + 3]! * mu + B[b + 6]! * mv) * inv;
    nodes[o + 1] = (B[b + 1]! * mc + B[b + 4]! * mu + B[b + 7]! * mv) * inv;
    nodes[o + 2] = (B[b + 2]! * mc + B[b + 5]! * mu + B[b + 8]! * mv) * inv;
    const r = pyr[t * 3]!;
    const g = pyr[t * 3 + 1]!;
    const bl = pyr[t * 3 + 2]!;
    nodes[o + 3] = r;
    nodes[o + 4] = g;
    nodes[o + 5] = bl;
    nodes[o + 6] = 0.2126 * r + 0.7152 * g + 0.0722 * bl;
    // The luminance-weighted mean direction vector: the geometric mean vector (length |mean|) plus the
    // centroid offset turned to the world frame; stored as its unit direction and its length, or length
    // -1 where the light is uniform (offset zero), so the walk weights that light exactly as the geometry.
    const yc = cent[t * 3]!;
    const yu = cent[t * 3 + 1]!;
    const yv = cent[t * 3 + 2]!;
    // Offsets below 1e-9 are rounding of a uniform texel's moments (float32 keeps about 1e-7 of a
    // direction anyway).
    if (yc * yc + yu * yu + yv * yv < 1e-18) {
      nodes[o + 7] = 0;
      nodes[o + 8] = 0;
      nodes[o + 9] = 0;
      nodes[o + 10] = -1;
      continue;
    }
    const m = geo[gi + 7]!;
    const lx = nodes[o]! * m + B[b]! * yc + B[b + 3]! * yu + B[b + 6]! * yv;
    const ly = nodes[o + 1]! * m + B[b + 1]! * yc + B[b + 4]! * yu + B[b + 7]! * yv;
    const lz = nodes[o + 2]! * m + B[b + 2]! * yc + B[b + 5]! * yu + B[b + 8]! * yv;
    const len = Math.sqrt(lx * lx + ly * ly + lz * lz);
    const invLen = len > 0 ? 1 / len : 0;
    nodes[o + 7] = lx * invLen;
    nodes[o + 8] = ly * invLen;
    nodes[o + 9] = lz * invLen;
    nodes[o + 10] = len < 1 ? len : 1;
  }
}
