import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { SystemModel } from '@vacnet/engine';
import { InProcessEngineRunner, type EngineJobOutcome, type EngineRunner } from './engine-runner.js';
import { ENGINE_WORKER_ROLE, type EngineJobMessage, type EngineReplyMessage } from './engine-worker.js';

/** After this many worker failures in a row with no success, jobs run on the main thread (our choice). */
const MAX_FAILURES_IN_A_ROW = 3;
/** Young generation of the analysis thread, MB (our choice, measured: 16 MB keeps the thread's memory about 30 MB lower than V8's default at no cost in analysis time). */
const YOUNG_GENERATION_MB = 16;
/** A job running longer than this is stopped and reported (our choice: ten times the 1,000-inlet analysis here). */
const DEFAULT_JOB_LIMIT_MS = 120_000;

interface Job {
  id: number;
  key: string;
  model: SystemModel;
  urgent: boolean;
  resolve: (outcome: EngineJobOutcome) => void;
  timer?: NodeJS.Timeout;
}

/**
 * Runs engine jobs on one worker thread, so a long analysis never blocks the
 * language server's replies. A newer job for the same key cancels the older
 * one: a queued job is dropped, a running one is stopped by terminating the
 * thread, and a fresh thread starts at once (warm by the next job). If the
 * thread cannot be started, jobs fall back to the main thread.
 */
export class WorkerEngineRunner implements EngineRunner {
  private worker: Worker | undefined;
  /** The current thread has said it is ready (so a later loss is the job's doing, not a failed start). */
  private ready = false;
  private running: Job | undefined;
  private readonly queue = new Map<string, Job>();
  private ids = 0;
  private failures = 0;
  private fallback: InProcessEngineRunner | undefined;
  private disposed = false;

  /** `entry`: the script that starts as an engine worker when given the worker role (the server's own entry). */
  constructor(
    entry: string,
    private readonly jobLimitMs = DEFAULT_JOB_LIMIT_MS,
  ) {
    this.entry = path.resolve(entry);
  }

  private readonly entry: string;

  run(key: string, model: SystemModel, urgent = true): Promise<EngineJobOutcome> {
    if (this.fallback) return this.fallback.run(key, model);
    if (this.disposed) return Promise.resolve({ kind: 'cancelled' });
    this.cancel(key);
    return new Promise<EngineJobOutcome>((resolve) => {
      this.queue.set(key, { id: ++this.ids, key, model, urgent, resolve });
      this.pump();
    });
  }

  cancel(key: string): void {
    this.fallback?.cancel(key);
    const queued = this.queue.get(key);
    if (queued) {
      this.queue.delete(key);
      queued.resolve({ kind: 'cancelled' });
    }
    if (this.running?.key === key) {
      const job = this.running;
      this.running = undefined;
      this.restart();
      finish(job, { kind: 'cancelled' });
      this.pump();
    }
  }

  dispose(): void {
    this.disposed = true;
    for (const key of [...this.queue.keys()]) this.cancel(key);
    if (this.running) this.cancel(this.running.key);
    void this.worker?.terminate();
    this.worker = undefined;
    this.fallback?.dispose();
  }

  /** Whether jobs now run on the main thread because the worker could not run. */
  get onMainThread(): boolean {
    return this.fallback !== undefined;
  }

  private pump(): void {
    if (this.running || this.disposed) return;
    // Open documents first, then in the order asked.
    const jobs = [...this.queue.values()];
    const job = jobs.find((j) => j.urgent) ?? jobs[0];
    if (!job) return;
    this.queue.delete(job.key);
    const worker = this.ensureWorker();
    if (!worker) {
      void this.toFallback(job);
      return;
    }
    this.running = job;
    job.timer = setTimeout(() => {
      if (this.running !== job) return;
      this.running = undefined;
      this.restart();
      finish(job, { kind: 'failed', message: `the analysis took longer than ${Math.round(this.jobLimitMs / 1000)} s and was stopped` });
      this.pump();
    }, this.jobLimitMs);
    job.timer.unref?.();
    const message: EngineJobMessage = { id: job.id, model: job.model };
    try {
      worker.postMessage(message);
    } catch {
      // A model that cannot be cloned is a defect; run it here rather than lose it.
      this.running = undefined;
      clearTimeout(job.timer);
      void this.toFallback(job);
    }
  }

  private ensureWorker(): Worker | undefined {
    if (this.worker) return this.worker;
    try {
      const worker = new Worker(this.entry, { workerData: { role: ENGINE_WORKER_ROLE }, stdout: false, stderr: false, resourceLimits: { maxYoungGenerationSizeMb: YOUNG_GENERATION_MB } });
      worker.unref();
      worker.on('message', (reply: EngineReplyMessage) => this.onReply(worker, reply));
      worker.on('error', (error) => this.onWorkerLost(worker, error instanceof Error ? error.message : String(error)));
      worker.on('exit', (code) => this.onWorkerLost(worker, `the analysis thread stopped (exit code ${code})`));
      this.worker = worker;
      this.ready = false;
      return worker;
    } catch {
      this.failures++;
      return undefined;
    }
  }

  private onReply(worker: Worker, reply: EngineReplyMessage): void {
    if (worker !== this.worker) return;
    if ('ready' in reply) {
      this.ready = true;
      return;
    }
    const job = this.running;
    if (!job || job.id !== reply.id) return;
    this.running = undefined;
    this.failures = 0;
    finish(job, reply.ok ? { kind: 'done', run: reply.run, ms: reply.ms } : { kind: 'failed', message: reply.message });
    this.pump();
  }

  private onWorkerLost(worker: Worker, message: string): void {
    if (worker !== this.worker) return; // a thread we stopped on purpose
    this.worker = undefined;
    this.failures++;
    const job = this.running;
    this.running = undefined;
    const startFailed = !this.ready;
    if (this.failures >= MAX_FAILURES_IN_A_ROW) this.fallback ??= new InProcessEngineRunner();
    if (job) {
      if (job.timer) clearTimeout(job.timer);
      // A thread that never got ready failed to start: the job itself is fine, run it here.
      // One that was running it died of the job (out of memory, say): report it, do not retry it here.
      if (startFailed) void this.toFallback(job);
      else finish(job, { kind: 'failed', message });
    }
    if (this.fallback) {
      for (const queued of [...this.queue.values()]) {
        this.queue.delete(queued.key);
        void this.toFallback(queued);
      }
    } else {
      this.pump();
    }
  }

  /** Stops the current thread (its job is stale) and starts a fresh one at once. */
  private restart(): void {
    const old = this.worker;
    this.worker = undefined;
    if (old) void old.terminate();
    if (!this.disposed && !this.fallback) this.ensureWorker();
  }

  /** Runs a job on this thread (the worker cannot take it), then goes on with the queue. */
  private async toFallback(job: Job): Promise<void> {
    if (this.failures >= MAX_FAILURES_IN_A_ROW) this.fallback ??= new InProcessEngineRunner();
    finish(job, await (this.fallback ?? new InProcessEngineRunner()).run(job.key, job.model));
    this.pump();
  }
}

function finish(job: Job, outcome: EngineJobOutcome): void {
  if (job.timer) clearTimeout(job.timer);
  job.resolve(outcome);
}
