/**
 * Runs parts-bin searches in worker threads (search-worker.ts), one worker per search, and lets the
 * screen ask how long the running ones have taken and stop them. A stopped search answers
 * CANCELLED; nothing is written either way (a search only reads). Workers are unref'd, so a search
 * left running never keeps the process from exiting.
 */
import { Worker } from 'node:worker_threads';
import { CheckerInputError, type SearchInput, type SearchResult } from '../checker/index.js';
import { AppFailure } from './failure.js';

export const CANCELLED_SENTENCE = 'The search was stopped before it finished; nothing was changed.';

export type SearchJobs = {
  run(input: SearchInput): Promise<SearchResult>;
  /** Stops every running search; answers how many were stopped. */
  cancelAll(): number;
  /** How many searches run, and for how long the oldest has run. */
  progress(): { running: number; elapsedMs: number };
};

/**
 * From source the worker needs tsx registered first; the bundle ships search-worker.js beside
 * main.js, unpacked from the asar archive (build/electron-builder.config.cjs) so a worker can load it.
 */
function workerUrl(): URL {
  if (import.meta.url.endsWith('.ts')) return new URL('./search-worker-boot.mjs', import.meta.url);
  return new URL(new URL('./search-worker.js', import.meta.url).href.replace('/app.asar/', '/app.asar.unpacked/'));
}

export function createSearchJobs(): SearchJobs {
  const running = new Map<Worker, { startedAt: number; cancel: () => void }>();
  return {
    run: (input) =>
      new Promise<SearchResult>((resolve, reject) => {
        const worker = new Worker(workerUrl());
        worker.unref();
        let settled = false;
        const finish = (fn: () => void): void => {
          if (settled) return;
          settled = true;
          running.delete(worker);
          void worker.terminate();
          fn();
        };
        running.set(worker, { startedAt: Date.now(), cancel: () => finish(() => reject(new AppFailure('CANCELLED', CANCELLED_SENTENCE))) });
        worker.on('message', (m: { ok: true; result: SearchResult } | { ok: false; name: string; message: string }) =>
          finish(() => (m.ok ? resolve(m.result) : reject(m.name === 'CheckerInputError' ? new CheckerInputError(m.message) : new Error(m.message)))),
        );
        worker.on('error', (err) => finish(() => reject(err)));
        worker.on('exit', (code) => finish(() => reject(new Error(`The search stopped unexpectedly (worker exit ${code}).`))));
        worker.postMessage(input);
      }),
    cancelAll: () => {
      const all = [...running.values()];
      for (const job of all) job.cancel();
      return all.length;
    },
    progress: () => {
      const starts = [...running.values()].map((j) => j.startedAt);
      return { running: starts.length, elapsedMs: starts.length ? Date.now() - Math.min(...starts) : 0 };
    },
  };
}
