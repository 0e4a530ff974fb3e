/**
 * Scratch timing probe for the parts-bin search and the comparison (not a test; `npm run bench` is
 * test/bench/run.ts, which this file leaves alone).
 *
 *   npx tsx test/bench/search-probe.ts [--bin bench|equivalence] [--baseline <dir>] [--rounds 15]
 *
 * Bin: 60 coils x 40 modules x 1 iron ballast (three ballast options: none, ballast, ballast with
 * cranking bypass) = 7200 combinations at 200 rpm points. `--bin bench` (the default) is the bin
 * and comparison `npm run bench` times (test/bench/generated.ts, same seed); `--bin equivalence`
 * is the wider-ranging bin of test/checker/generated-bin.ts. With --baseline (a copy of
 * electron/checker, with a package.json saying "type": "module" beside it) the two
 * implementations run interleaved in the same process, round by round, so both see the same
 * machine load, and the probe first checks that they return the same result.
 */
import { loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { isDeepStrictEqual } from 'node:util';
import * as current from '../../electron/checker/index.js';
import { generatedSearch } from '../checker/generated-bin.js';
import { ballastCoil, cdModule, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from '../checker/fixtures.js';
import { benchBallast, benchEngine, generatedCoil, generatedModule, seeded, setupOf } from './generated.js';

type Api = Pick<typeof current, 'searchBest' | 'compareSetups'>;

function arg(name: string, fallback: string | null): string | null {
  const i = process.argv.indexOf(name);
  return i >= 0 && i + 1 < process.argv.length ? process.argv[i + 1]! : fallback;
}

const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : 0.5 * (s[m - 1]! + s[m]!);
};
const fmt = (xs: number[]): string => `median ${median(xs).toFixed(2)}  min ${Math.min(...xs).toFixed(2)}  max ${Math.max(...xs).toFixed(2)}`;

/** The bench's bin and comparison, built exactly as test/bench/run.ts builds them. */
function benchInputs(): [current.SearchInput, current.ComparisonInput] {
  const r = seeded(20240301);
  const coils = Array.from({ length: 60 }, (_, i) => generatedCoil(r, i));
  const modules = Array.from({ length: 40 }, (_, i) => generatedModule(r, i));
  const existing = setupOf('Existing points', coils[0]!, null, benchBallast, true);
  const candidates = [setupOf('Candidate A', coils[1]!, modules[2]!, null, false), setupOf('Candidate B', coils[2]!, modules[1]!, null, false), setupOf('Candidate C', coils[3]!, modules[3]!, null, false)];
  return [
    { engine: benchEngine, existing, coils, modules, ballasts: [benchBallast], tach: null, leads: existing.leads, plug: existing.plug, plugGapM: existing.plugGapM, options: { rpmPoints: 200 }, topN: 5 },
    { engine: benchEngine, existing, candidates, options: { rpmPoints: 200 } },
  ];
}

function equivalenceInputs(): [current.SearchInput, current.ComparisonInput] {
  return [
    generatedSearch({ coils: 60, modules: 40, ballasts: 1, seed: 20240611, rpmPoints: 200, topN: 5 }),
    {
      engine: fourCylinder,
      existing: pointsSetup(),
      candidates: [moduleSetup(module()), moduleSetup(cdModule()), pointsSetup({ label: 'Ballast', coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true })],
      options: { rpmPoints: 200 },
    },
  ];
}

const [searchInput, compareInput] = arg('--bin', 'bench') === 'equivalence' ? equivalenceInputs() : benchInputs();

interface Sample { wallMs: number; cpuMs: number }

function timeOnce(f: () => unknown): Sample {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  f();
  const wallMs = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return { wallMs, cpuMs: (c.user + c.system) / 1000 };
}

/** One compare call is short, so time a batch and divide. */
function timeCompare(api: Api, batch: number): Sample {
  const s = timeOnce(() => { for (let k = 0; k < batch; k++) api.compareSetups(compareInput); });
  return { wallMs: s.wallMs / batch, cpuMs: s.cpuMs / batch };
}

async function main(): Promise<void> {
  const rounds = Number(arg('--rounds', '15'));
  const baseDir = arg('--baseline', null);
  const impls: Array<[string, Api]> = [['current', current]];
  if (baseDir) impls.unshift(['baseline', (await import(`${baseDir.replace(/\/$/, '')}/index.ts`)) as Api]);

  console.log(`load before: ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
  const first = impls.map(([, api]) => api.searchBest(searchInput));
  const r = first[first.length - 1]!;
  console.log(`evaluated ${r.evaluated}, without a fail ${r.withoutFail}, rejected ${JSON.stringify(r.rejectedByRule)}`);
  if (first.length === 2) {
    const same = (a: unknown, b: unknown): boolean => isDeepStrictEqual(a, b) && JSON.stringify(a) === JSON.stringify(b);
    const compared = impls.map(([, api]) => api.compareSetups(compareInput));
    console.log(`baseline and current identical: search ${same(first[0], first[1])}, comparison ${same(compared[0], compared[1])}`);
  }

  // Warm-up: let the JIT settle on both.
  for (let k = 0; k < 3; k++) for (const [, api] of impls) { api.searchBest(searchInput); timeCompare(api, 50); }

  const search = new Map<string, Sample[]>(impls.map(([n]) => [n, []]));
  const compare = new Map<string, Sample[]>(impls.map(([n]) => [n, []]));
  // Searches and comparisons in separate phases, so that no comparison batch pays for the
  // garbage a search just left; within a phase, alternate which implementation goes first.
  for (let k = 0; k < rounds; k++) {
    const order = k % 2 === 0 ? impls : [...impls].reverse();
    for (const [name, api] of order) search.get(name)!.push(timeOnce(() => api.searchBest(searchInput)));
  }
  for (let k = 0; k < rounds; k++) {
    const order = k % 2 === 0 ? impls : [...impls].reverse();
    for (const [name, api] of order) compare.get(name)!.push(timeCompare(api, 100));
  }
  for (const [name] of impls) {
    const s = search.get(name)!;
    const c = compare.get(name)!;
    console.log(`${name.padEnd(8)} searchBest   wall ms ${fmt(s.map((x) => x.wallMs))} | cpu ms ${fmt(s.map((x) => x.cpuMs))}`);
    console.log(`${name.padEnd(8)} compareSetups wall ms ${fmt(c.map((x) => x.wallMs))} | cpu ms ${fmt(c.map((x) => x.cpuMs))}`);
  }
  console.log(`load after: ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
}

await main();
