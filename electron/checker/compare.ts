/**
 * The comparison: the existing setup beside up to three candidates, on the same engine, the same
 * conditions and the same rpm grid, each candidate judged against the existing one.
 */
import { toReport } from './report.js';
import { analyse, baselineOf, createSession } from './session.js';
import { createWorkspace, type Workspace } from './sweep.js';
import { CheckerInputError, type ComparisonInput, type ComparisonReport, type ComparisonRow, type SetupReport } from './types.js';

export const MAX_CANDIDATES = 3;

/** The workspaces of the last comparison, taken by the next one (null while one is in use). */
let spareWorkspaces: { ws: Workspace; keyWs: Workspace } | null = null;

function row(r: SetupReport): ComparisonRow {
  return { label: r.label, verdict: r.verdict, ...r.keyPoints, belowMarginFromRpm: r.belowMarginFromRpm };
}

export function compareSetups(input: ComparisonInput): ComparisonReport {
  if (input.candidates.length > MAX_CANDIDATES) {
    throw new CheckerInputError(`Compare at most ${MAX_CANDIDATES} candidates with the existing setup at once.`);
  }
  const s = createSession(input.engine, input.conditions, input.options);
  const withGap = !(input.options?.skipGapSuggestion ?? false);
  // One pair of workspaces for all: each analysis is turned into its report before the next.
  // The pair is kept for the next comparison too (no report keeps a reference to a workspace).
  const n = s.grids.sweep.n;
  const spare = spareWorkspaces !== null && spareWorkspaces.ws.n === n ? spareWorkspaces : null;
  spareWorkspaces = null;
  const ws = spare ? spare.ws : createWorkspace(n);
  const keyWs = spare ? spare.keyWs : createWorkspace(s.grids.key.n);
  const ex = analyse(s, input.existing, null, withGap, ws, keyWs);
  const existing = toReport(s, ex);
  const base = baselineOf(ex, 'the existing setup');
  const candidates = input.candidates.map((c) => toReport(s, analyse(s, c, base, withGap, ws, keyWs)));
  spareWorkspaces = { ws, keyWs };
  return { conditions: s.conditions, existing, candidates, rows: [existing, ...candidates].map(row) };
}
