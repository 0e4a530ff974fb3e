/**
 * The renderer's boundary, checked on its source: it imports no Node code, only React, zod, its
 * own files and the two shared contract files (db/schema.ts, electron/ipc/channels.ts).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { projectRoot } from './harness.js';

const rendererDir = path.join(projectRoot, 'renderer');
const allowedPackages = new Set(['react', 'react-dom/client', 'react/jsx-runtime', 'zod']);
const allowedShared = new Set([
  path.join(projectRoot, 'db', 'schema.ts'),
  // The working-condition descriptors schema.ts builds its conditions from (and re-exports); they import nothing.
  path.join(projectRoot, 'db', 'conditions.ts'),
  path.join(projectRoot, 'electron', 'ipc', 'channels.ts'),
  // The checker answers' shapes; channels.ts re-exports them, and they import only zod.
  path.join(projectRoot, 'electron', 'ipc', 'check-shapes.ts'),
  // The wiring sheet's shapes; channels.ts re-exports them, and they import zod and schema.ts.
  path.join(projectRoot, 'electron', 'ipc', 'sheet-shapes.ts'),
  // The records screen's shapes (backups, workshop files, CSV); re-exported by channels.ts, they import zod and schema.ts.
  path.join(projectRoot, 'electron', 'ipc', 'records-shapes.ts'),
  // The text rules schema.ts applies to what is typed (invisible, control and direction characters); type-only zod import.
  path.join(projectRoot, 'db', 'text-rules.ts'),
]);

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return sourceFiles(full);
    return /\.(ts|tsx)$/.test(name) && name !== 'vite.config.ts' ? [full] : [];
  });
}

function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const found: string[] = [];
  for (const m of text.matchAll(/(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|import\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)) {
    found.push((m[1] ?? m[2] ?? m[3])!);
  }
  return found;
}

describe('the renderer boundary', () => {
  it('imports only React, zod, its own files and the two shared contract files', () => {
    const files = sourceFiles(rendererDir);
    expect(files.length).toBeGreaterThan(10);
    const offences: string[] = [];
    for (const file of files) {
      for (const spec of importsOf(file)) {
        if (spec.startsWith('.')) {
          const target = path.resolve(path.dirname(file), spec).replace(/\.js$/, '.ts');
          const inside = target.startsWith(rendererDir + path.sep);
          if (!inside && !allowedShared.has(target)) offences.push(`${path.relative(projectRoot, file)} imports ${spec}`);
        } else if (!allowedPackages.has(spec)) {
          offences.push(`${path.relative(projectRoot, file)} imports the package ${spec}`);
        }
      }
    }
    expect(offences).toEqual([]);
  });

  it('the shared contract files themselves import only zod and each other, so nothing else reaches the bundle', () => {
    const offences: string[] = [];
    for (const file of allowedShared) {
      for (const spec of importsOf(file)) {
        if (spec.startsWith('.')) {
          const target = path.resolve(path.dirname(file), spec).replace(/\.js$/, '.ts');
          if (!allowedShared.has(target)) offences.push(`${path.relative(projectRoot, file)} imports ${spec}`);
        } else if (spec !== 'zod') {
          offences.push(`${path.relative(projectRoot, file)} imports the package ${spec}`);
        }
      }
    }
    expect(offences).toEqual([]);
  });
});
