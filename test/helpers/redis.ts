/** A Redis server for the farm tests: Debian redis-server on a free 127.0.0.1 port, stopped by its PID. */

import { spawn, type ChildProcess } from 'node:child_process';
import { freePort } from './nginx.js';
import { stopChild } from './tools.js';

export interface RedisServer {
  readonly url: string;
  readonly port: number;
  stop(): Promise<void>;
  start(): Promise<void>;
}

export async function startRedis(): Promise<RedisServer> {
  const port = await freePort();
  let child: ChildProcess | null = null;
  const start = async (): Promise<void> => {
    child = spawn('redis-server', ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--maxmemory-policy', 'noeviction'], { stdio: ['ignore', 'pipe', 'ignore'] });
    const c = child;
    await new Promise<void>((resolve, reject) => {
      let text = '';
      const timer = setTimeout(() => reject(new Error('redis-server did not start')), 10_000);
      c.stdout!.on('data', (chunk: Buffer) => {
        text += chunk.toString();
        if (text.includes('Ready to accept connections')) {
          clearTimeout(timer);
          resolve();
        }
      });
      c.once('exit', () => reject(new Error('redis-server exited')));
    });
  };
  await start();
  return {
    url: `redis://127.0.0.1:${port}`,
    port,
    start,
    async stop(): Promise<void> {
      await stopChild(child);
      child = null;
    },
  };
}
