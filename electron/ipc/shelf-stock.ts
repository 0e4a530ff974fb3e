/**
 * How many of each part the shelf still has for a search on one engine. A part that plans marked
 * as fitted (status 'wired' or 'done') on OTHER engines already use is, as far as the shelf goes,
 * on those cars: each such plan takes one. When they take every one the shelf holds, the part is
 * left out of the search and the screen says why. Plans of the engine searched for never count
 * (fitting the part to this engine is what the search is about), and neither do the parts of this
 * engine's existing setup (they are on this engine already and the search needs them).
 *
 * Pure: stored records in, the free parts and the reasons out; the handler (check-handlers.ts)
 * reads the store and passes the free parts to the search, which itself is left as it is.
 */
import type { Engine, Part, Plan, PlanStatus } from '../../db/schema.js';

/** The statuses that mean the plan's parts are on the car. */
export const FITTED_STATUSES: readonly PlanStatus[] = ['wired', 'done'];

const PLAN_PART_KEYS = ['moduleId', 'coilId', 'ballastId', 'tachId', 'leadsId', 'plugId'] as const;
const EXISTING_PART_KEYS = ['coilPartId', 'ballastPartId', 'tachPartId', 'leadsPartId', 'plugPartId'] as const;

export type FittedUse = { planId: number; planName: string; engineId: number; engineName: string; status: PlanStatus };
export type LeftOutPart = { partId: number; partName: string; kind: Part['kind']; quantity: number; fittedTo: FittedUse[]; reason: string };
export type ShelfStock = { free: Part[]; leftOut: LeftOutPart[] };

const statusWords: Record<PlanStatus, string> = { draft: 'draft', checked: 'checked', wired: 'marked wired', done: 'marked done' };

function useText(u: FittedUse): string {
  return `“${u.planName}” on ${u.engineName} (${statusWords[u.status]})`;
}

function listText(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** Why a part was left out, in the person's words: "Both of your 2 are fitted: ...". */
export function leftOutReason(quantity: number, uses: readonly FittedUse[]): string {
  const where = listText(uses.map(useText));
  const more = uses.length > quantity ? ` (${uses.length} plans marked as fitted use it, more than the ${quantity} you have: check the count on the shelf)` : '';
  if (quantity === 1) return `Your only one is fitted to ${where}${more}.`;
  if (quantity === 2) return `Both of your 2 are fitted: to ${where}${more}.`;
  return `All ${quantity} of yours are fitted: to ${where}${more}.`;
}

/**
 * The parts a search for `engine` may use, and the ones left out because plans marked as fitted
 * on other engines use every one of them. `engineNames` names the other engines for the sentence.
 */
export function shelfStock(engine: Engine, parts: readonly Part[], plans: readonly Plan[], engineNames: ReadonlyMap<number, string>): ShelfStock {
  const onThisEngine = new Set<number>();
  for (const key of EXISTING_PART_KEYS) {
    const id = engine.existing[key];
    if (typeof id === 'number') onThisEngine.add(id);
  }
  const uses = new Map<number, FittedUse[]>();
  for (const plan of plans) {
    if (plan.engineId === engine.id || !FITTED_STATUSES.includes(plan.status)) continue;
    const use: FittedUse = { planId: plan.id, planName: plan.name, engineId: plan.engineId, engineName: engineNames.get(plan.engineId) ?? `engine ${plan.engineId}`, status: plan.status };
    // A plan names a part at most once per slot, and each slot holds a different kind.
    for (const key of PLAN_PART_KEYS) {
      const id = plan[key];
      if (typeof id === 'number') uses.set(id, [...(uses.get(id) ?? []), use]);
    }
  }
  const free: Part[] = [];
  const leftOut: LeftOutPart[] = [];
  for (const part of parts) {
    const fitted = uses.get(part.id) ?? [];
    const quantity = part.quantity;
    if (onThisEngine.has(part.id) || fitted.length < quantity) {
      free.push(part);
      continue;
    }
    leftOut.push({ partId: part.id, partName: part.name, kind: part.kind, quantity, fittedTo: fitted, reason: leftOutReason(quantity, fitted) });
  }
  return { free, leftOut };
}
