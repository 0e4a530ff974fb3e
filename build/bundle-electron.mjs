// Bundles the Node side for Electron with esbuild.
//   electron/main.ts    -> dist-electron/main.js     ESM; electron and better-sqlite3 stay external
//                                                     (the native module is loaded from node_modules,
//                                                     rebuilt for Electron's ABI at packaging)
//   electron/preload.ts -> dist-electron/preload.cjs CommonJS with everything inlined: a sandboxed
//                                                     preload may only require('electron')
//   electron/cli.ts     -> dist-electron/cli.mjs     ESM for plain Node, if the file exists, with
//                                                     renderer/styles/sheet.css copied beside it
import { build } from 'esbuild';
import { copyFileSync, existsSync, mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
// `--cli-only --out <dir>`: the command line alone, into <dir> (the command-line tests run the
// bundle they build this way, so they test what ships and start in a fraction of tsx's time).
const argv = process.argv.slice(2);
const cliOnly = argv.includes('--cli-only');
const outAt = argv.indexOf('--out');
const outDir = outAt >= 0 && argv[outAt + 1] ? path.resolve(argv[outAt + 1]) : path.join(root, 'dist-electron');
const at = (p) => path.join(root, p);

// ESM output cannot call require(); some bundled CommonJS code does, so give it one.
const requireShim = "import { createRequire as __createRequire } from 'node:module'; const require = __createRequire(import.meta.url);";

const common = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  sourcemap: true,
  legalComments: 'none',
  logLevel: 'warning',
  absWorkingDir: root,
};

if (!cliOnly) rmSync(outDir, { recursive: true, force: true });
mkdirSync(outDir, { recursive: true });

const jobs = cliOnly ? [] : [
  build({
    ...common,
    entryPoints: [at('electron/main.ts')],
    outfile: path.join(outDir, 'main.js'),
    format: 'esm',
    external: ['electron', 'better-sqlite3'],
    banner: { js: requireShim },
  }),
  // The parts-bin search's worker thread (electron/ipc/search-runner.ts starts it beside main.js).
  build({
    ...common,
    entryPoints: [at('electron/ipc/search-worker.ts')],
    outfile: path.join(outDir, 'search-worker.js'),
    format: 'esm',
    banner: { js: requireShim },
  }),
  build({
    ...common,
    entryPoints: [at('electron/preload.ts')],
    outfile: path.join(outDir, 'preload.cjs'),
    format: 'cjs',
    external: ['electron'],
  }),
];

const cli = at('electron/cli.ts');
if (existsSync(cli)) {
  jobs.push(
    build({
      ...common,
      entryPoints: [cli],
      outfile: path.join(outDir, 'cli.mjs'),
      format: 'esm',
      external: ['better-sqlite3'],
      banner: { js: requireShim },
    }),
  );
  // The checklist command inlines the sheet's stylesheet into its HTML; it reads it beside the bundle.
  copyFileSync(at('renderer/styles/sheet.css'), path.join(outDir, 'sheet.css'));
} else {
  console.log('electron/cli.ts is not there yet: skipped dist-electron/cli.mjs.');
}

await Promise.all(jobs);
console.log(`Bundled ${jobs.length} entry point(s) into ${path.relative(root, outDir)}/.`);
