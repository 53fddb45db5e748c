/** Content hashing for cache keys and manifests. */

import { createHash } from 'node:crypto';

export function sha256Hex(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** JSON with object keys sorted, so equal values always hash equally. */
export function stableJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map(stableJson).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
}

/** A cache key: sha256 of the stage name, its algorithm version and everything it depends on. */
export function stageKey(stage: string, version: number, parts: unknown): string {
  return createHash('sha256').update(stableJson({ stage, version, parts })).digest('hex');
}
