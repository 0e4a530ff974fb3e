/**
 * The best combination from a parts bin: every module x coil x ballast option (none, or each
 * ballast on the shelf with and without a cranking bypass) on one engine. Each combination is
 * swept into one reused workspace and judged by the rules' fail tests alone (judge.ts); only the
 * top N are analysed again for full reports, so the report of a combination is the one
 * `checkSetup` gives it.
 * Ranking: combinations without a fail first, then the worst-rpm reserve ratio (higher first),
 * then the energy at redline (higher first); ties keep the bin order.
 */
import { judge, type Judgement } from './judge.js';
import { keyOnReport } from './keyon.js';
import { withCrankingBypass } from './cranking.js';
import { prepareSetup, type PreparedSetup } from './prepare.js';
import { toReport } from './report.js';
import { FAIL_TESTS } from './rules/index.js';
import { analyse, baselineOf, createSession } from './session.js';
import { createWorkspace } from './sweep.js';
import type { BallastSpec, CoilSpec, ModuleSpec, RuleId, SearchCandidate, SearchInput, SearchResult, SetupSpec } from './types.js';

interface Scored {
  coil: number;
  module: number;
  ballast: number;
  bypass: boolean;
  noFail: boolean;
  worst: number;
  energyAtRedline: number;
}

function candidateSetup(input: SearchInput, coil: CoilSpec, mod: ModuleSpec, ballast: BallastSpec | null, bypass: boolean, named = true): SetupSpec {
  return {
    label: named ? `${mod.name} with ${coil.name}${ballast ? `, ${ballast.name}${bypass ? ' and cranking bypass' : ''}` : ''}` : 'candidate',
    switching: mod.moduleType,
    coil,
    ballast,
    crankingBypass: bypass,
    moduleFeed: 'switched-15',
    module: mod,
    condenserF: null,
    tach: input.tach,
    leads: input.leads,
    plug: input.plug,
    plugGapM: input.plugGapM,
    magneto: null,
  };
}

function better(a: Scored, b: Scored): number {
  if (a.noFail !== b.noFail) return a.noFail ? -1 : 1;
  if (a.worst !== b.worst) return b.worst - a.worst;
  return b.energyAtRedline - a.energyAtRedline;
}

export function searchBest(input: SearchInput): SearchResult {
  const s = createSession(input.engine, input.conditions, input.options);
  const ex = analyse(s, input.existing, null, false);
  const base = baselineOf(ex, 'the existing setup');
  const ws = createWorkspace(s.grids.sweep.n);
  const redline = s.grids.redlineIndex;
  const failed = new Uint8Array(FAIL_TESTS.length);
  const scored: Scored[] = [];
  const rejected: Partial<Record<RuleId, number>> = {};
  let withoutFail = 0;
  const record = (coil: number, mod: number, ballast: number, bypass: boolean, j: Judgement): void => {
    if (j.fails) {
      for (let k = 0; k < failed.length; k++) {
        if (failed[k] === 1) {
          const id = FAIL_TESTS[k]![0];
          rejected[id] = (rejected[id] ?? 0) + 1;
        }
      }
    } else {
      withoutFail++;
    }
    scored.push({ coil, module: mod, ballast, bypass, noFail: !j.fails, worst: j.worstRatio, energyAtRedline: ws.energyJ[redline]! });
  };
  const prepare = (setup: SetupSpec): PreparedSetup => prepareSetup(s.engine, setup, s.conditions, s.model);
  // Bin order (module, coil, then no ballast, then each ballast without and with a cranking
  // bypass); the sort below is stable, so ties keep this order.
  for (let mi = 0; mi < input.modules.length; mi++) {
    const mod = input.modules[mi]!;
    for (let ci = 0; ci < input.coils.length; ci++) {
      const coil = input.coils[ci]!;
      const bare = prepare(candidateSetup(input, coil, mod, null, false, false));
      record(ci, mi, -1, false, judge(s, bare, keyOnReport(bare, s.conditions), base, ws, failed));
      for (let bi = 0; bi < input.ballasts.length; bi++) {
        const ballast = input.ballasts[bi]!;
        const plain = prepare(candidateSetup(input, coil, mod, ballast, false, false));
        // The bypass twin runs exactly as `plain` does (the bypass is open once the starter stops,
        // and the ballast heats while running), and key-on is with the starter still: only the
        // cranking path differs, so only it and the cranking points are worked out again.
        const twin = withCrankingBypass(plain, candidateSetup(input, coil, mod, ballast, true, false), s.conditions);
        const keyOn = keyOnReport(plain, s.conditions);
        record(ci, mi, bi, false, judge(s, plain, keyOn, base, ws, failed));
        record(ci, mi, bi, true, judge(s, twin, keyOn, base, ws, failed, { crankingOnly: true }));
      }
    }
  }
  scored.sort(better);
  const topN = Math.max(0, Math.floor(input.topN ?? 5));
  const withGap = !(input.options?.skipGapSuggestion ?? false);
  const top: SearchCandidate[] = scored.slice(0, topN).map((sc) => {
    const setup = candidateSetup(input, input.coils[sc.coil]!, input.modules[sc.module]!, sc.ballast >= 0 ? input.ballasts[sc.ballast]! : null, sc.bypass);
    return { coilIndex: sc.coil, moduleIndex: sc.module, ballastIndex: sc.ballast, crankingBypass: sc.bypass, report: toReport(s, analyse(s, setup, base, withGap)) };
  });
  return { evaluated: scored.length, withoutFail, top, rejectedByRule: rejected };
}
