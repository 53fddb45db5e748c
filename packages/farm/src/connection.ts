/** Redis connections for BullMQ (redis://[user:password@]host:port[/db]); credentials are never printed. */

import { Redis } from 'ioredis';
import { redactUrl } from '@lightkiln/bake';

export function redisConnection(url: string): Redis {
  // BullMQ needs maxRetriesPerRequest null on blocking connections; reconnect forever with a short backoff,
  // so a Redis restart between jobs is survived by workers and submitters alike.
  return new Redis(url, { maxRetriesPerRequest: null, enableReadyCheck: true, retryStrategy: (times) => Math.min(1000, 50 * times) });
}

/** The URL without credentials (for messages): the same rule as the shared cache's URLs. */
export const redactRedisUrl: (url: string) => string = redactUrl;
