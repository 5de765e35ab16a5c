// The whole pipeline run in a worker thread under a time and a memory limit: a drawing that makes any stage loop
// ends in a "hang" outcome, one that exhausts 1 GiB in a "crash", instead of stalling or killing the test run.
// Needs the build (`npm test` builds first).

import { Worker } from 'node:worker_threads';

export type Outcome =
  | { outcome: 'report' }
  | { outcome: 'input-error'; message: string }
  | { outcome: 'crash'; message: string }
  | { outcome: 'hang'; message: string };

export class GuardedPipeline {
  private worker: Worker | null = null;

  /** Heap a run may use, MiB (V8's old generation; a run past it ends the worker with an out-of-memory error). */
  static readonly MEMORY_LIMIT_MB = 1024;

  constructor(private readonly timeLimitMs: number) {}

  /** Checks `bytes` with the raw `config`; a run over the time limit is stopped and reported as a hang. */
  run(bytes: Uint8Array, config: unknown): Promise<Outcome> {
    const worker = (this.worker ??= new Worker(new URL('./pipeline-worker.mjs', import.meta.url), {
      resourceLimits: { maxOldGenerationSizeMb: GuardedPipeline.MEMORY_LIMIT_MB },
    }));
    return new Promise((resolve) => {
      const settle = (outcome: Outcome, stopWorker: boolean) => {
        clearTimeout(timer);
        worker.removeAllListeners('message').removeAllListeners('error');
        if (stopWorker) {
          void worker.terminate();
          this.worker = null;
        }
        resolve(outcome);
      };
      const timer = setTimeout(
        () => settle({ outcome: 'hang', message: `no result within ${this.timeLimitMs} ms` }, true),
        this.timeLimitMs,
      );
      worker.once('message', (m: Outcome) => settle(m, false));
      worker.once('error', (err) => settle({ outcome: 'crash', message: `the worker died: ${err.message}` }, true));
      worker.postMessage({ bytes, config });
    });
  }

  async close(): Promise<void> {
    await this.worker?.terminate();
    this.worker = null;
  }
}
