// Running from source (tsx, the tests, the browser host): a worker thread does not inherit the
// parent's TypeScript loader, so it registers tsx itself before loading the worker. The bundled
// desktop app starts dist-electron/search-worker.js instead (build/bundle-electron.mjs).
import { register } from 'tsx/esm/api';

register();
await import('./search-worker.ts');
