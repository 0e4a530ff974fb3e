#!/usr/bin/env node
/**
 * The mutation score per file and in all, from the committed incremental file (every file any run
 * has covered, not only the last run's): `node test/mutation/score.mjs [--survivors] [path-prefix]`.
 * Score = (killed + timed out) / (killed + timed out + survived + no coverage), as StrykerJS counts
 * it; compile errors and ignored mutants are not counted. With --survivors, each surviving mutant is
 * listed with its line and the code it changed.
 */
import { readFileSync } from 'node:fs';

const args = process.argv.slice(2);
const listSurvivors = args.includes('--survivors');
const prefix = args.find((a) => !a.startsWith('--')) ?? '';
const incremental = JSON.parse(readFileSync(new URL('./stryker-incremental.json', import.meta.url), 'utf8'));

const rows = [];
const total = { killed: 0, survived: 0, files: 0 };
for (const [file, { mutants, source }] of Object.entries(incremental.files).sort(([a], [b]) => a.localeCompare(b))) {
  if (!file.startsWith(prefix)) continue;
  let killed = 0;
  let survived = 0;
  const lines = source.split('\n');
  const left = [];
  for (const m of mutants) {
    if (m.status === 'Killed' || m.status === 'Timeout') killed++;
    else if (m.status === 'Survived' || m.status === 'NoCoverage') {
      survived++;
      const line = m.location.start.line;
      const column = m.location.start.column;
      left.push(`  ${file}:${line}:${column} [${m.status}] ${m.mutatorName}: ${JSON.stringify(m.replacement)}  |  ${lines[line - 1].trim().slice(0, 100)}`);
    }
  }
  total.killed += killed;
  total.survived += survived;
  total.files++;
  rows.push({ file, killed, survived, score: killed + survived === 0 ? 100 : (100 * killed) / (killed + survived), left });
}
const pad = (s, n) => String(s).padEnd(n);
for (const r of rows) {
  console.log(`${pad(r.file, 46)} ${pad(r.score.toFixed(1) + ' %', 8)} killed ${pad(r.killed, 5)} survived ${r.survived}`);
  if (listSurvivors) for (const l of r.left) console.log(l);
}
const all = total.killed + total.survived;
console.log(`${total.files} files: ${total.killed} killed of ${all}, score ${all === 0 ? '-' : ((100 * total.killed) / all).toFixed(1)} %`);
