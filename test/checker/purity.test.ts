/**
 * The checker is pure by its imports alone: nothing from Electron, Node built-ins, the DOM, the
 * store, or anywhere outside electron/checker.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../../electron/checker');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

const BUILTINS = ['fs', 'path', 'os', 'child_process', 'crypto', 'url', 'util', 'events', 'stream', 'http', 'https', 'net', 'worker_threads', 'module', 'process', 'buffer', 'zlib'];

describe('electron/checker purity', () => {
  const all = files(root);
  it('has source files to scan', () => {
    expect(all.length).toBeGreaterThan(10);
  });
  for (const file of all) {
    const name = relative(root, file);
    it(`${name} imports only from inside electron/checker and uses no DOM or Node globals`, () => {
      const src = readFileSync(file, 'utf8');
      const specs = [...src.matchAll(/(?:import|export)[^'"]*?from\s*['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|require\s*\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1] ?? m[2] ?? m[3] ?? '');
      for (const s of specs) {
        expect(s.startsWith('.'), `${name}: '${s}' is not a relative import`).toBe(true);
        expect(s.startsWith('node:') || BUILTINS.includes(s) || s.includes('electron/') && !s.includes('checker')).toBe(false);
        const target = resolve(dirname(file), s);
        expect(target.startsWith(root), `${name}: '${s}' reaches outside electron/checker`).toBe(true);
      }
      const code = src.replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '').replace(/(['"`])(?:\\.|(?!\1).)*\1/g, '""');
      for (const g of ['window', 'document', 'navigator', 'localStorage', 'process', 'require', 'Buffer', '__dirname']) {
        expect(new RegExp(`\\b${g}\\b`).test(code), `${name} uses the global '${g}'`).toBe(false);
      }
    });
  }
});
