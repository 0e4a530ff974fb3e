/**
 * The parts-bin search in a worker thread (node:worker_threads), so the main process (and with it
 * every other request, and in the desktop app the window) keeps answering while it runs. It gets
 * the checker's plain SearchInput (structured-cloned) and posts back the SearchResult, or the
 * checker's error by name and sentence. search-runner.ts starts it, one worker per search.
 */
import { parentPort } from 'node:worker_threads';
import { searchBest, type SearchInput } from '../checker/index.js';

parentPort?.on('message', (input: SearchInput) => {
  try {
    parentPort!.postMessage({ ok: true, result: searchBest(input) });
  } catch (err) {
    parentPort!.postMessage({ ok: false, name: err instanceof Error ? err.name : 'Error', message: err instanceof Error ? err.message : String(err) });
  }
});
