/** Kernel modules: built ES modules that export `kernels`, a record of named range kernels. */

import type { SharedBuffers } from './shared.js';

/**
 * A range kernel processes items [begin, end) reading and writing the shared buffers in place.
 * It must write only its own items, so that results never depend on scheduling.
 */
export type RangeKernel<P = unknown> = (buffers: SharedBuffers, begin: number, end: number, params: P) => void;

/** What a kernel module exports. */
export interface KernelModule {
  readonly kernels: Readonly<Record<string, RangeKernel<never>>>;
  /** Optional: run by WorkerPool.warm in each worker (e.g. the kernels once on tiny inputs, for the JIT). */
  readonly warmUp?: () => Promise<void> | void;
}

/** Names a kernel by the URL of its built module and its key in that module's `kernels`. */
/**
 * A kernel by module and export name. P is the kernel's parameter type, carried for the compiler only
 * (never set at run time), so a job whose params do not fit its kernel fails to compile.
 */
export interface KernelRef<P = never> {
  readonly moduleUrl: string;
  readonly name: string;
  readonly __params?: (params: P) => void;
}

const moduleCache = new Map<string, Promise<KernelModule>>();

/** Imports a kernel module once per thread and returns the named kernel. */
export async function loadKernel(ref: KernelRef): Promise<RangeKernel<unknown>> {
  let mod = moduleCache.get(ref.moduleUrl);
  if (mod === undefined) {
    mod = import(ref.moduleUrl) as Promise<KernelModule>;
    moduleCache.set(ref.moduleUrl, mod);
  }
  let loaded: KernelModule;
  try {
    loaded = await mod;
  } catch (error) {
    moduleCache.delete(ref.moduleUrl);
    throw error;
  }
  const kernel = loaded.kernels?.[ref.name];
  if (typeof kernel !== 'function') {
    throw new Error(`kernel module ${ref.moduleUrl} has no kernel named "${ref.name}"`);
  }
  return kernel as RangeKernel<unknown>;
}

/**
 * Resolves `relative` (a built `.js` sibling, e.g. "./worker.js") against the module at `importMetaUrl`,
 * in the built tree: when the caller runs from TypeScript sources (tests), `.../src/x.ts` stands for
 * `.../dist/x.js`, because worker threads load built files only.
 */
export function builtModuleUrl(importMetaUrl: string, relative: string): string {
  let base = importMetaUrl;
  if (base.endsWith('.ts')) {
    const idx = base.lastIndexOf('/src/');
    if (idx >= 0) base = `${base.slice(0, idx)}/dist/${base.slice(idx + 5)}`;
  }
  return new URL(relative, base).href;
}
