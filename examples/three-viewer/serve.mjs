#!/usr/bin/env node
/**
 * A small static server for the viewer: the page and its scripts from this folder, three.js from this
 * example's node_modules, and a folder of baked probes under /assets/. Listens on 127.0.0.1 (port 0 picks
 * a free one) and prints the URL.
 *
 *   node examples/three-viewer/serve.mjs out 8080   # then open http://127.0.0.1:8080/?probe=observatory-dusk
 */

import { createServer } from 'node:http';
import { readFile } from 'node:fs/promises';
import { extname, join, normalize, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = resolve(fileURLToPath(new URL('.', import.meta.url)));
const TYPES = { '.html': 'text/html', '.mjs': 'text/javascript', '.js': 'text/javascript', '.json': 'application/json', '.ktx2': 'image/ktx2' };

/** Starts the server; resolves to { url, close() }. */
export function startViewerServer(assetsDir, port = 0) {
  const roots = [
    ['/assets/', resolve(assetsDir)],
    ['/three/', join(here, 'node_modules', 'three')],
    ['/', here],
  ];
  const server = createServer(async (req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://localhost').pathname);
    const [prefix, root] = roots.find(([p]) => path.startsWith(p));
    const rel = path === '/' ? 'index.html' : path.slice(prefix.length);
    const file = normalize(join(root, rel));
    // Only files under the root (no "..").
    if (file !== root && !file.startsWith(root + sep)) {
      res.writeHead(403).end();
      return;
    }
    try {
      const body = await readFile(file);
      res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' }).end(body);
    } catch {
      res.writeHead(404).end();
    }
  });
  return new Promise((ok, fail) => {
    server.once('error', fail);
    server.listen(port, '127.0.0.1', () => {
      const { port: bound } = server.address();
      ok({ url: `http://127.0.0.1:${bound}/`, close: () => new Promise((done) => server.close(() => done())) });
    });
  });
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const [assets = 'out', port = '0'] = process.argv.slice(2);
  const { url } = await startViewerServer(assets, Number(port));
  console.log(`${url}?probe=<name>  (probes from ${resolve(assets)}; Ctrl-C to stop)`);
}
