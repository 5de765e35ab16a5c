// The whole pipeline run in a worker thread under a time limit: a drawing that makes any stage loop ends
// in a "hang" outcome instead of stalling the test run. Needs the build (`npm test` builds first).

import { Worker } from 'node:worker_threads';

export type Outcome =
  | { outcome: 'report' }
  | { outcome: 'input-error'; message: string }
  | { outcome: 'crash'; message: string }
  | { outcome: 'hang'; message: string };

export class GuardedPipeline {
  private worker: Worker | null = null;

  constructor(private readonly timeLimitMs: number) {}

  /** Checks `bytes` with the raw `config`; a run over the time limit is stopped and reported as a hang. */
  run(bytes: Uint8Array, config: unknown): Promise<Outcome> {
    const worker = (this.worker ??= new Worker(new URL('./pipeline-worker.mjs', import.meta.url)));
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
      const timer = setTimeout(() => settle({ outcome: 'hang', message: `no result within ${this.timeLimitMs} ms` }, true), this.timeLimitMs);
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
