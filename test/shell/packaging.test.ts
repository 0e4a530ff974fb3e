/**
 * A real electron-builder 26 `--dir` build of the app, with the production config, except for
 * what cannot happen on a machine without internet: the Electron zip is replaced by a stand-in
 * folder holding one fake `electron` executable, and the native rebuild (which needs Electron's
 * headers) is switched off. electron-builder needs nothing else from the Electron folder for a
 * Linux `--dir` build (found by trying).
 *
 * The stand-in executable carries a genuine fuse wire: the sentinel and layout @electron/fuses
 * looks for (github.com/electron/fuses, src/constants.ts and src/index.ts: sentinel
 * "dL7pKGdnNz796PbbjQWNKmHXBZaB9tsX", then version byte 1, wire length, one ASCII '0'/'1' per
 * fuse). Each fuse starts in the opposite state to the one we configure, so the test proves the
 * packaging step really flipped every one of them.
 */
import { getRawHeader, extractFile, statFile } from '@electron/asar';
import { execFile } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const run = promisify(execFile);
const require = createRequire(import.meta.url);
const root = path.resolve(import.meta.dirname, '../..');
const realConfig = require(path.join(root, 'build/electron-builder.config.cjs')) as {
  electronFuses: Record<string, boolean>;
  asarUnpack: string[];
  npmRebuild: boolean;
  buildDependenciesFromSource: boolean;
  productName: string;
  executableName: string;
};

const SENTINEL = 'dL7pKGdnNz796PbbjQWNKmHXBZaB9tsX';
// Fuse order of wire version 1 (@electron/fuses FuseV1Options).
const FUSES = [
  'runAsNode',
  'enableCookieEncryption',
  'enableNodeOptionsEnvironmentVariable',
  'enableNodeCliInspectArguments',
  'enableEmbeddedAsarIntegrityValidation',
  'onlyLoadAppFromAsar',
  'loadBrowserProcessSpecificV8Snapshot',
  'grantFileProtocolExtraPrivileges',
] as const;
const WANTED: Record<string, boolean> = {
  runAsNode: false,
  enableCookieEncryption: true,
  enableNodeOptionsEnvironmentVariable: false,
  enableNodeCliInspectArguments: false,
  enableEmbeddedAsarIntegrityValidation: true,
  onlyLoadAppFromAsar: true,
};

function fuseWireOf(binary: Buffer): string {
  const at = binary.indexOf(SENTINEL);
  if (at < 0) throw new Error('no fuse sentinel in the packaged executable');
  const version = binary[at + SENTINEL.length];
  const length = binary[at + SENTINEL.length + 1]!;
  expect(version).toBe(1);
  return binary.subarray(at + SENTINEL.length + 2, at + SENTINEL.length + 2 + length).toString('latin1');
}

let work: string;
let appOutDir: string;
let seconds = 0;
let builderLog = '';

beforeAll(async () => {
  if (!existsSync(path.join(root, 'dist/renderer/index.html'))) {
    throw new Error('dist/renderer/index.html is missing: run npm run build:renderer first.');
  }
  work = mkdtempSync(path.join(os.tmpdir(), 'ignition-pack-'));
  // The stand-in Electron: a shell script (so it is a real executable) with a fuse wire inside.
  const electronDist = path.join(work, 'electron-dist');
  mkdirSync(electronDist);
  const startWire = FUSES.map((f) => (f in WANTED ? (WANTED[f] ? '0' : '1') : '0')).join('');
  const fake = Buffer.concat([
    Buffer.from('#!/bin/sh\necho "stand-in for the Electron binary"\nexit 0\n# '),
    Buffer.from(SENTINEL, 'latin1'),
    Buffer.from([1, FUSES.length]),
    Buffer.from(startWire, 'latin1'),
    Buffer.from('\n'),
  ]);
  writeFileSync(path.join(electronDist, 'electron'), fake);
  chmodSync(path.join(electronDist, 'electron'), 0o755);

  const output = path.join(work, 'out');
  const testConfig = path.join(work, 'test-config.cjs');
  writeFileSync(
    testConfig,
    `const base = require(${JSON.stringify(path.join(root, 'build/electron-builder.config.cjs'))});
module.exports = {
  ...base,
  electronDist: ${JSON.stringify(electronDist)},
  electronVersion: require(${JSON.stringify(path.join(root, 'node_modules/electron/package.json'))}).version,
  npmRebuild: false,                   // test only: the rebuild needs Electron's headers from the internet
  buildDependenciesFromSource: false,
  directories: { ...base.directories, output: ${JSON.stringify(output)} },
};
`,
  );

  const started = performance.now();
  await run(process.execPath, [path.join(root, 'build/bundle-electron.mjs')], { cwd: root });
  const arch = process.arch === 'arm64' ? '--arm64' : '--x64';
  const builder = path.join(root, 'node_modules/electron-builder/cli.js');
  const result = await run(process.execPath, [builder, '--dir', '--linux', arch, '--config', testConfig, '--projectDir', root], {
    cwd: root,
    env: { ...process.env, ELECTRON_SKIP_BINARY_DOWNLOAD: '1', CI: '1' },
    maxBuffer: 16 * 1024 * 1024,
  });
  builderLog = `${result.stdout}\n${result.stderr}`;
  seconds = (performance.now() - started) / 1000;
  appOutDir = path.join(output, process.arch === 'arm64' ? 'linux-arm64-unpacked' : 'linux-unpacked');
}, 240_000);

afterAll(() => {
  if (work) rmSync(work, { recursive: true, force: true });
});

describe('packaging with electron-builder (--dir, linux, stand-in Electron)', () => {
  it('finishes well under a few minutes', () => {
    console.log(`electron-builder --dir took ${seconds.toFixed(1)} s`);
    expect(seconds).toBeLessThan(120);
  });

  it('produces the executable under the product name and an app.asar', () => {
    expect(existsSync(path.join(appOutDir, realConfig.executableName)), builderLog).toBe(true);
    expect(existsSync(path.join(appOutDir, 'resources', 'app.asar')), builderLog).toBe(true);
  });

  it('puts package.json in the asar with main pointing at a file that is also in the asar', () => {
    const asar = path.join(appOutDir, 'resources', 'app.asar');
    const pkg = JSON.parse(extractFile(asar, 'package.json').toString('utf8')) as { main: string };
    expect(pkg.main).toBe('dist-electron/main.js');
    expect(extractFile(asar, pkg.main).toString('utf8')).toContain('setPermissionRequestHandler');
    expect(extractFile(asar, 'dist-electron/preload.cjs').toString('utf8')).toContain('exposeInMainWorld');
    expect(extractFile(asar, 'dist/renderer/index.html').toString('utf8')).toMatch(/<html/i);
  });

  it('keeps better-sqlite3\'s .node file outside the asar, byte for byte, as an ELF shared object', () => {
    const rel = 'node_modules/better-sqlite3/build/Release/better_sqlite3.node';
    const unpacked = path.join(appOutDir, 'resources', 'app.asar.unpacked', rel);
    expect(existsSync(unpacked)).toBe(true);
    const bytes = readFileSync(unpacked);
    expect(bytes.subarray(0, 4)).toEqual(Buffer.from([0x7f, 0x45, 0x4c, 0x46])); // ELF magic (System V ABI)
    expect(bytes.equals(readFileSync(path.join(root, rel)))).toBe(true);
    // In the archive header the entry is marked unpacked, so Electron redirects the load.
    const entry = statFile(path.join(appOutDir, 'resources', 'app.asar'), rel) as { unpacked?: boolean };
    expect(entry.unpacked).toBe(true);
  });

  it('packs the runtime dependencies of better-sqlite3 and leaves out what the bundles already hold', () => {
    const header = getRawHeader(path.join(appOutDir, 'resources', 'app.asar')).header as { files: Record<string, { files?: Record<string, unknown> }> };
    const modules = Object.keys(header.files['node_modules']?.files ?? {});
    expect(modules).toContain('better-sqlite3');
    expect(modules).toContain('bindings'); // better-sqlite3 finds its .node file through it
    for (const bundled of ['react', 'react-dom', 'zod', 'electron', 'vite', 'typescript']) expect(modules).not.toContain(bundled);
  });

  it('flipped every configured fuse in the packaged executable', () => {
    const wire = fuseWireOf(readFileSync(path.join(appOutDir, realConfig.executableName)));
    FUSES.forEach((name, i) => {
      if (name in WANTED) expect(`${name}=${wire[i]}`).toBe(`${name}=${WANTED[name] ? '1' : '0'}`);
    });
  });
});

describe('the production packaging config', () => {
  it('sets the fuses the Electron security guide recommends', () => {
    expect(realConfig.electronFuses).toMatchObject(WANTED);
  });

  it('rebuilds native modules for Electron and unpacks better-sqlite3\'s .node file', () => {
    expect(realConfig.npmRebuild).toBe(true);
    expect(realConfig.buildDependenciesFromSource).toBe(true);
    expect(realConfig.asarUnpack.some((p) => p.includes('better-sqlite3') && p.endsWith('.node'))).toBe(true);
    expect(realConfig.productName).toBe('Ignition Planner');
  });
});
