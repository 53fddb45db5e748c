/**
 * Package boundaries (DEVELOPERS.md, "Packages"): dependencies point one way (cli -> farm -> bake -> {pool, codecs,
 * math}, codecs -> math), nobody reaches into another package's src/ or dist/, and the public API of every
 * package is pinned by a snapshot of the typeof of each export (as vitest's own exports test does).
 */

import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import * as bake from '@lightkiln/bake';
import * as codecs from '@lightkiln/codecs';
import * as math from '@lightkiln/math';
import * as pool from '@lightkiln/pool';

const root = fileURLToPath(new URL('..', import.meta.url));
const allowed: Record<string, string[]> = {
  math: [],
  codecs: ['math'],
  pool: [],
  bake: ['math', 'codecs', 'pool'],
  farm: ['bake'],
  cli: ['bake', 'farm'],
};

function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? sources(join(dir, e.name)) : e.name.endsWith('.ts') ? [join(dir, e.name)] : []));
}

describe('dependency direction', () => {
  for (const [pkg, deps] of Object.entries(allowed)) {
    it(`${pkg} imports only ${deps.length > 0 ? deps.join(', ') : 'no lightkiln package'}, never through src/ or dist/`, () => {
      const manifest = JSON.parse(readFileSync(join(root, 'packages', pkg, 'package.json'), 'utf8')) as { dependencies?: Record<string, string> };
      const declared = Object.keys(manifest.dependencies ?? {}).filter((d) => d.startsWith('@lightkiln/')).map((d) => d.slice(11)).sort();
      expect(declared).toEqual([...deps].sort());
      for (const file of sources(join(root, 'packages', pkg, 'src'))) {
        const text = readFileSync(file, 'utf8');
        for (const m of text.matchAll(/from '(@lightkiln\/[^']+)'/g)) {
          const spec = m[1]!;
          const name = spec.split('/')[1]!;
          expect(deps, `${file} imports ${spec}`).toContain(name);
          expect(spec, `${file}: deep import`).not.toMatch(/\/(src|dist)\//);
        }
        expect(text, `${file}: relative import into another package`).not.toMatch(/from '\.\.\/\.\.\/\.\.\//);
      }
    });
  }
});

function shape(mod: Record<string, unknown>): Record<string, string> {
  return Object.fromEntries(Object.keys(mod).sort().map((k) => [k, typeof mod[k]]));
}

describe('public API', () => {
  it('math exports', () => expect(shape(math)).toMatchSnapshot());
  it('codecs exports', () => expect(shape(codecs)).toMatchSnapshot());
  it('pool exports', () => expect(shape(pool)).toMatchSnapshot());
  it('bake exports', () => expect(shape(bake)).toMatchSnapshot());
});
