/**
 * A WebDAV file server for the shared-cache tests: Debian nginx with its built-in WebDAV module (PUT,
 * DELETE, folders created on PUT), on a free 127.0.0.1 port, in a temporary folder, stopped by its PID.
 */

import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, connect } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { stopChild } from './tools.js';

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address !== null ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

async function waitForPort(port: number, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const ok = await new Promise<boolean>((resolve) => {
      const socket = connect(port, '127.0.0.1');
      socket.once('connect', () => { socket.destroy(); resolve(true); });
      socket.once('error', () => resolve(false));
    });
    if (ok) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`nothing listens on 127.0.0.1:${port} after ${timeoutMs} ms`);
}

export interface DavServer {
  readonly url: string;
  readonly port: number;
  /** The folder the server stores into (cas/ and ac/ appear under it). */
  readonly data: string;
  stop(): Promise<void>;
  start(): Promise<void>;
}

export async function startDavServer(): Promise<DavServer> {
  const dir = mkdtempSync(join(tmpdir(), 'lightkiln-dav-'));
  const data = join(dir, 'data');
  mkdirSync(data);
  const port = await freePort();
  const conf = join(dir, 'nginx.conf');
  const asRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  writeFileSync(conf, `${asRoot ? 'user root;\n' : ''}daemon off;
worker_processes 1;
pid ${dir}/nginx.pid;
error_log ${dir}/error.log warn;
events { worker_connections 64; }
http {
  access_log off;
  client_body_temp_path ${dir}/body;
  proxy_temp_path ${dir}/proxy;
  fastcgi_temp_path ${dir}/fastcgi;
  uwsgi_temp_path ${dir}/uwsgi;
  scgi_temp_path ${dir}/scgi;
  server {
    listen 127.0.0.1:${port};
    root ${data};
    client_max_body_size 1g;
    location / {
      dav_methods PUT DELETE;
      create_full_put_path on;
      dav_access user:rw group:r all:r;
    }
  }
}
`);
  let child: ChildProcess | null = null;
  const start = async (): Promise<void> => {
    child = spawn('nginx', ['-c', conf, '-p', dir, '-e', join(dir, 'error.log')], { stdio: 'ignore' });
    await waitForPort(port, 10_000);
  };
  const stop = async (): Promise<void> => {
    await stopChild(child);
    child = null;
  };
  await start();
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    data,
    start,
    async stop(): Promise<void> {
      await stop();
    },
  };
}

/** Stops the server and removes its folder. */
export async function disposeDavServer(server: DavServer): Promise<void> {
  await server.stop();
  rmSync(server.data.replace(/\/data$/, ''), { recursive: true, force: true });
}
