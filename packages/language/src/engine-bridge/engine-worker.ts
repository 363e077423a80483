import v8 from 'node:v8';
import vm from 'node:vm';
import { parentPort, workerData } from 'node:worker_threads';
import type { SystemModel } from '@vacnet/engine';
import { runEngine } from './engine-run.js';

/** What the server's entry passes as workerData to start a thread as an engine worker. */
export const ENGINE_WORKER_ROLE = 'vacnet-engine-worker';

export interface EngineJobMessage {
  id: number;
  model: SystemModel;
}

export type EngineReplyMessage =
  | { id: number; ok: true; run: ReturnType<typeof runEngine>; ms: number }
  | { id: number; ok: false; message: string }
  /** Sent once when the thread is ready for jobs. */
  | { ready: true };

/** True when this thread was started as an engine worker. */
export function isEngineWorker(): boolean {
  return parentPort !== null && (workerData as { role?: unknown } | undefined)?.role === ENGINE_WORKER_ROLE;
}

/**
 * The worker thread's side: answers each job with the engine's run of the
 * model, or the error that stopped it. Needs only the engine, so the thread
 * starts without loading the language services.
 */
export function serveEngineWorker(): void {
  const port = parentPort;
  if (!port) return;
  const collect = garbageCollector();
  port.on('message', (job: EngineJobMessage) => {
    const started = performance.now();
    let reply: EngineReplyMessage;
    try {
      reply = { id: job.id, ok: true, run: runEngine(job.model), ms: performance.now() - started };
    } catch (error) {
      reply = { id: job.id, ok: false, message: error instanceof Error ? error.message : String(error) };
    }
    port.postMessage(reply);
    // An analysis leaves tens of megabytes of garbage on a large system; hand it back while the thread waits.
    setImmediate(collect);
  });
  port.postMessage({ ready: true } satisfies EngineReplyMessage);
}

/** A full collection on this thread, when V8 lets us have one (it does through the flag set here); else nothing. */
function garbageCollector(): () => void {
  try {
    v8.setFlagsFromString('--expose-gc');
    const gc = vm.runInNewContext('gc') as unknown;
    return typeof gc === 'function' ? () => (gc as () => void)() : () => undefined;
  } catch {
    return () => undefined;
  }
}
