/**
 * The parts-bin search in a worker thread (node:worker_threads), so the main process (and with it
 * every other request, and in the desktop app the window) keeps answering while it runs. It gets
 * the checker's plain SearchInput (structured-cloned) and posts back the SearchResult, or the
 * checker's error by name and sentence, after progress messages (module-and-coil pairs tried of
 * all). search-runner.ts starts it, one worker per search.
 */
import { parentPort } from 'node:worker_threads';
import { searchBest, type SearchInput } from '../checker/index.js';

parentPort?.on('message', (input: SearchInput) => {
  try {
    // At most about a hundred progress messages, however large the bin.
    let last = 0;
    const result = searchBest(input, (done, total) => {
      if (done === total || (done - last) / total >= 0.01) {
        last = done;
        parentPort!.postMessage({ progress: { done, total } });
      }
    });
    parentPort!.postMessage({ ok: true, result });
  } catch (err) {
    parentPort!.postMessage({ ok: false, name: err instanceof Error ? err.name : 'Error', message: err instanceof Error ? err.message : String(err) });
  }
});
