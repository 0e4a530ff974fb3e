/**
 * The benchmark (`npm run bench`; not a timed test). Medians and spread over N runs after a
 * warm-up, for:
 *   1. one full check: existing setup + three candidates, 200 rpm points, every rule and the
 *      plug-gap suggestion (goal <= 0.3 ms median, issue 6);
 *   2. the parts-bin search: 60 coils x 40 modules x 3 ballast options (none, a ballast, the same
 *      ballast with a cranking bypass) = 7200 combinations at 200 rpm points (goal <= 100 ms median, one core, issue 6);
 *   3. one operating point by the checker and by an ngspice run (the break deck), as a ratio.
 * Prints a table and writes test-output/bench.json. Parts are invented and generated from a seed.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { availableParallelism, cpus } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { checkSetup, compareSetups, searchBest, type ComparisonInput, type SearchInput } from '../../electron/checker/index.js';
import { buildDeck, circuitFromReport } from '../../electron/spice/index.js';
import { ngspiceVersion, runNgspice } from '../reference/ngspice.js';
import { benchBallast, benchEngine, generatedCoil, generatedModule, seeded, setupOf } from './generated.js';

interface Stats {
  runs: number;
  medianMs: number;
  minMs: number;
  p10Ms: number;
  p90Ms: number;
  maxMs: number;
}

function quantile(sorted: number[], q: number): number {
  const pos = (sorted.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (pos - lo);
}

function time(run: () => unknown, warmup: number, runs: number): Stats {
  for (let i = 0; i < warmup; i++) run();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    run();
    t.push(performance.now() - start);
  }
  t.sort((a, b) => a - b);
  return { runs, medianMs: quantile(t, 0.5), minMs: t[0]!, p10Ms: quantile(t, 0.1), p90Ms: quantile(t, 0.9), maxMs: t[t.length - 1]! };
}

/** The goals (medians), as issue 6 set them. */
const CHECK_GOAL_MS = 0.3;
const SEARCH_GOAL_MS = 100;

const r = seeded(20240301);
const coils = Array.from({ length: 60 }, (_, i) => generatedCoil(r, i));
const modules = Array.from({ length: 40 }, (_, i) => generatedModule(r, i));
const existing = setupOf('Existing points', coils[0]!, null, benchBallast, true);

// 1. One full check.
const comparison: ComparisonInput = {
  engine: benchEngine,
  existing,
  candidates: [
    setupOf('Candidate A', coils[1]!, modules[2]!, null, false),
    setupOf('Candidate B', coils[2]!, modules[1]!, null, false),
    setupOf('Candidate C', coils[3]!, modules[3]!, null, false),
  ],
  options: { rpmPoints: 200 },
};
const check = time(() => compareSetups(comparison), 30, 300);

// 2. The parts-bin search.
const search: SearchInput = {
  engine: benchEngine,
  existing,
  coils,
  modules,
  ballasts: [benchBallast],
  tach: null,
  leads: existing.leads,
  plug: existing.plug,
  plugGapM: existing.plugGapM,
  options: { rpmPoints: 200 },
  topN: 5,
};
const evaluated = searchBest(search).evaluated;
const searchStats = time(() => searchBest(search), 2, 15);

// 3. One operating point: the checker (the smallest sweep, cranking, idle and redline; no gap search) against one ngspice run.
const spec = setupOf('Single point', coils[4]!, modules[2]!, null, false);
const single = checkSetup(benchEngine, spec, undefined, { rpmPoints: 3, skipGapSuggestion: true });
const rpm = single.points.at(-1)!.rpm;
const checkerPoint = time(() => checkSetup(benchEngine, spec, undefined, { rpmPoints: 3, skipGapSuggestion: true }), 200, 2000);
const deck = buildDeck(circuitFromReport(spec, single, rpm), 'break');
const ngspicePoint = time(() => runNgspice(deck.text, deck.measures), 2, 15);

const rows: Array<[string, Stats, string]> = [
  ['full check: existing + 3 candidates, 200 rpm points, all rules', check, `<= ${CHECK_GOAL_MS} ms`],
  [`parts-bin search: 60 coils x 40 modules x 3 ballast options (${evaluated} setups), 200 rpm points`, searchStats, `<= ${SEARCH_GOAL_MS} ms`],
  [`one operating point (${Math.round(rpm)} rpm), checker`, checkerPoint, ''],
  [`one operating point (${Math.round(rpm)} rpm), ngspice break deck incl. process start`, ngspicePoint, ''],
];

const f = (ms: number): string => (ms < 1 ? ms.toFixed(3) : ms < 100 ? ms.toFixed(2) : ms.toFixed(0)).padStart(9);
const width = Math.max(...rows.map(([name]) => name.length));
console.log(`\n${'case'.padEnd(width)}  runs   median      min      p10      p90      max   goal (ms)`);
for (const [name, s, goal] of rows) {
  console.log(`${name.padEnd(width)}  ${String(s.runs).padStart(4)} ${f(s.medianMs)}${f(s.minMs)}${f(s.p10Ms)}${f(s.p90Ms)}${f(s.maxMs)}   ${goal}`);
}
const ratio = ngspicePoint.medianMs / checkerPoint.medianMs;
console.log(`\nngspice / checker for one operating point: ${ratio.toFixed(0)} x (medians)`);
const goals = { checkMet: check.medianMs <= CHECK_GOAL_MS, searchMet: searchStats.medianMs <= SEARCH_GOAL_MS };
console.log(`goals: full check ${goals.checkMet ? 'met' : 'NOT met'}, search ${goals.searchMet ? 'met' : 'NOT met'}\n`);

const out = resolve(import.meta.dirname, '../../test-output/bench.json');
mkdirSync(dirname(out), { recursive: true });
writeFileSync(
  out,
  `${JSON.stringify(
    {
      date: new Date().toISOString(),
      node: process.version,
      cpu: cpus()[0]?.model ?? 'unknown',
      cores: availableParallelism(),
      ngspice: ngspiceVersion(),
      fullCheck: { ...check, goalMs: CHECK_GOAL_MS, met: goals.checkMet },
      search: { ...searchStats, setupsEvaluated: evaluated, goalMs: SEARCH_GOAL_MS, met: goals.searchMet },
      operatingPoint: { rpm, checker: checkerPoint, ngspice: ngspicePoint, ngspiceOverChecker: ratio },
    },
    null,
    2,
  )}\n`,
);
console.log(`written ${join('test-output', 'bench.json')}`);
