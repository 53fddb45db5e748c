/**
 * `@lightkiln/farm`: batch bakes on a BullMQ job queue (Redis) with inputs and results in a shared cache
 * server (HTTP build-cache protocol): a client that submits and collects, and a worker an existing
 * service can host.
 */

export { FarmClient } from './client.js';
export type { FarmClientOptions, FarmProbeResult } from './client.js';
export { startFarmWorker } from './worker.js';
export type { FarmWorker, FarmWorkerOptions } from './worker.js';
export { DEFAULT_QUEUE, jobIdFor } from './protocol.js';
export type { FarmArtifact, FarmInput, FarmJobData, FarmJobResult } from './protocol.js';
export { redactRedisUrl } from './connection.js';
