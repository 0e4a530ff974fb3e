/**
 * One "what to do" list per setup, merged from the rules' actions: ordered (fails first, then
 * cautions, each in report order), each sentence once, and without contradictions. Each rule
 * tags its action with what it asks for (`Intent`); two intents in `CONTRADICTIONS` cannot both be
 * done (fit a ballast and remove it, a longer dwell and a shorter one). When a later action asks
 * for the opposite of one already listed it is left out; if it came from a failing rule, a
 * sentence says that no single change cures both, so nothing is hidden.
 */
import type { Intent, RuleResult } from './types.js';

/** Pairs of intents that cannot both be advised for one setup. */
export const CONTRADICTIONS: ReadonlyArray<readonly [Intent, Intent]> = [
  ['ballast:add', 'ballast:remove'],
  ['ballast:keep', 'ballast:remove'],
  ['bypass:add', 'bypass:remove'],
  ['coil-resistance:raise', 'coil-resistance:lower'],
  ['dwell:longer', 'dwell:shorter'],
  ['gap:close', 'gap:widen'],
  ['condenser:fit', 'condenser:remove'],
];

const opposite = new Map<Intent, Intent[]>();
for (const [a, b] of CONTRADICTIONS) {
  opposite.set(a, [...(opposite.get(a) ?? []), b]);
  opposite.set(b, [...(opposite.get(b) ?? []), a]);
}

/** Whether two lists of intents ask for opposite things. */
export function contradicts(a: readonly Intent[], b: readonly Intent[]): boolean {
  return a.some((x) => (opposite.get(x) ?? []).some((y) => b.includes(y)));
}

const RANK = { fail: 0, caution: 1, pass: 2 } as const;

/** The merged, ordered list of what to do for one setup's rule results (pass results add nothing). */
export function whatToDo(rules: readonly RuleResult[]): string[] {
  // Array.prototype.sort is stable (ES2019), so rules of one verdict keep the report's order.
  const order = rules.filter((r) => r.verdict !== 'pass').sort((x, y) => RANK[x.verdict] - RANK[y.verdict]);
  const out: string[] = [];
  const taken: Array<{ title: string; intents: readonly Intent[] }> = [];
  for (const r of order) {
    const intents = r.intents ?? [];
    const clash = taken.find((t) => contradicts(t.intents, intents));
    if (clash) {
      if (r.verdict === 'fail') {
        const line = `"${clash.title}" and "${r.title}" pull opposite ways, so no single change to these parts cures both: choose a different coil or module.`;
        if (!out.includes(line)) out.push(line);
      }
      continue;
    }
    taken.push({ title: r.title, intents });
    if (!out.includes(r.action)) out.push(r.action);
  }
  return out;
}
