/**
 * Runs parts-bin searches in worker threads (search-worker.ts), one worker per search, and lets the
 * screen ask how long the running ones have taken, how far the oldest has got, and stop them. A stopped search answers
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
  /** How many searches run, for how long the oldest has run, and the share of its combinations tried (0 to 1). */
  progress(): { running: number; elapsedMs: number; share: number };
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
  const running = new Map<Worker, { startedAt: number; share: number; cancel: () => void }>();
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
        const job = { startedAt: Date.now(), share: 0, cancel: () => finish(() => reject(new AppFailure('CANCELLED', CANCELLED_SENTENCE))) };
        running.set(worker, job);
        worker.on('message', (m: { progress: { done: number; total: number } } | { ok: true; result: SearchResult } | { ok: false; name: string; message: string }) => {
          if ('progress' in m) {
            job.share = m.progress.total > 0 ? m.progress.done / m.progress.total : 0;
            return;
          }
          finish(() => (m.ok ? resolve(m.result) : reject(m.name === 'CheckerInputError' ? new CheckerInputError(m.message) : new Error(m.message))));
        });
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
      const jobs = [...running.values()];
      if (jobs.length === 0) return { running: 0, elapsedMs: 0, share: 0 };
      const oldest = jobs.reduce((a, b) => (b.startedAt < a.startedAt ? b : a));
      return { running: jobs.length, elapsedMs: Date.now() - oldest.startedAt, share: oldest.share };
    },
  };
}
