/**
 * The best combination from a parts bin: every module x coil x ballast option (none, or each
 * ballast on the shelf with and without a cranking bypass) on one engine. Each combination is
 * swept into one reused workspace and judged by the rules; only the top N get full reports.
 * Ranking: combinations without a fail first, then the worst-rpm reserve ratio (higher first),
 * then the energy at redline (higher first).
 */
import { toReport } from './report.js';
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
  const kws = createWorkspace(s.grids.key.n);
  const redline = s.grids.redlineIndex;
  const scored: Scored[] = [];
  const rejected: Partial<Record<RuleId, number>> = {};
  let withoutFail = 0;
  const options: Array<[number, boolean]> = [[-1, false]];
  for (let b = 0; b < input.ballasts.length; b++) options.push([b, false], [b, true]);
  for (let mi = 0; mi < input.modules.length; mi++) {
    const mod = input.modules[mi]!;
    for (let ci = 0; ci < input.coils.length; ci++) {
      const coil = input.coils[ci]!;
      for (const [bi, bypass] of options) {
        const ballast = bi >= 0 ? input.ballasts[bi]! : null;
        const a = analyse(s, candidateSetup(input, coil, mod, ballast, bypass, false), base, false, ws, kws);
        let fail = false;
        for (const r of a.rules) {
          if (r.verdict === 'fail') {
            fail = true;
            rejected[r.id] = (rejected[r.id] ?? 0) + 1;
          }
        }
        if (!fail) withoutFail++;
        scored.push({ coil: ci, module: mi, ballast: bi, bypass, noFail: !fail, worst: a.worstRatio, energyAtRedline: ws.energyJ[redline]! });
      }
    }
  }
  scored.sort(better);
  const topN = Math.max(0, Math.floor(input.topN ?? 5));
  const top: SearchCandidate[] = scored.slice(0, topN).map((sc) => {
    const setup = candidateSetup(input, input.coils[sc.coil]!, input.modules[sc.module]!, sc.ballast >= 0 ? input.ballasts[sc.ballast]! : null, sc.bypass);
    const withGap = !(input.options?.skipGapSuggestion ?? false);
    return { coilIndex: sc.coil, moduleIndex: sc.module, ballastIndex: sc.ballast, crankingBypass: sc.bypass, report: toReport(s, analyse(s, setup, base, withGap)) };
  });
  return { evaluated: scored.length, withoutFail, top, rejectedByRule: rejected };
}
