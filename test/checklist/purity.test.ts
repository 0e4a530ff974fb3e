/**
 * The wiring-sheet builder is pure by its imports alone: nothing from Electron, Node built-ins,
 * the DOM, the store or a library; only relative imports into electron/checklist, electron/checker
 * and electron/safety. No clock either: the date printed comes in with the input.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const electron = resolve(dirname(fileURLToPath(import.meta.url)), '../../electron');
const root = join(electron, 'checklist');
const allowed = [root, join(electron, 'checker'), join(electron, 'safety')];

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

const inside = (target: string): boolean => allowed.some((a) => target === a || target.startsWith(a + sep));

describe('electron/checklist purity', () => {
  const all = files(root);
  it('has source files to scan', () => {
    expect(all.length).toBeGreaterThan(10);
  });
  it('the check itself catches a bad import (a Node built-in, the store, a library)', () => {
    for (const bad of ['node:fs', '../../db/schema.js', 'zod', '../ipc/channels.js']) {
      const ok = bad.startsWith('.') && inside(resolve(root, bad));
      expect(ok, bad).toBe(false);
    }
  });
  for (const file of all) {
    const name = relative(root, file);
    it(`${name} imports only from electron/checklist, electron/checker or electron/safety and uses no DOM, Node or clock`, () => {
      const src = readFileSync(file, 'utf8');
      const specs = [...src.matchAll(/(?:import|export)[^'"]*?from\s*['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|require\s*\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1] ?? m[2] ?? m[3] ?? '');
      for (const s of specs) {
        expect(s.startsWith('.'), `${name}: '${s}' is not a relative import`).toBe(true);
        expect(inside(resolve(dirname(file), s)), `${name}: '${s}' reaches outside electron/checklist, checker and safety`).toBe(true);
      }
      const code = src.replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '').replace(/(['"`])(?:\\.|(?!\1).)*\1/g, '""');
      for (const g of ['window', 'document', 'navigator', 'localStorage', 'process', 'require', 'Buffer', '__dirname', 'Date', 'performance', 'setTimeout', 'fetch']) {
        expect(new RegExp(`\\b${g}\\b`).test(code), `${name} uses the global '${g}'`).toBe(false);
      }
    });
  }
});
