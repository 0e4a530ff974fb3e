/**
 * A plan as the form holds it (typed text and part ids as strings) and back to a PlanInput,
 * checked with the store's own schema so the messages beside the fields are the store's messages.
 * The plug gap is typed in the person's unit; the plan stores millimetres.
 */
import { fieldMessages, planInput, type Engine, type Plan, type PlanInput, type PlanStatus } from '../../../db/schema.js';
import type { ShelfSuggestion } from '../../../electron/ipc/channels.js';
import { numberToText, parseNumberText } from '../../app/numbers.js';
import { gapFromMm, type GapValue } from '../../app/gaps.js';
import type { GapUnit } from '../../app/units.js';

export type PlanForm = {
  name: string;
  notes: string;
  moduleId: string;
  coilId: string;
  ballastId: string;
  crankingBypass: boolean;
  moduleFeed: PlanInput['moduleFeed'];
  coilWiring: NonNullable<PlanInput['coilWiring']>;
  tachId: string;
  leadsId: string;
  plugId: string;
  plugGap: GapValue;
};

const idText = (v: number | null): string => (v === null ? '' : String(v));
const idOf = (t: string): number | null => (t.trim() === '' ? null : Number(t));

/** A new plan keeps everything the engine has today; the person picks what changes. */
export function blankPlanForm(engine: Engine, unit: GapUnit): PlanForm {
  return {
    name: '',
    notes: '',
    moduleId: '',
    coilId: '',
    ballastId: '',
    crankingBypass: false,
    moduleFeed: 'switched-15',
    coilWiring: 'as-marked-for-earth',
    tachId: '',
    leadsId: '',
    plugId: '',
    plugGap: gapFromMm(engine.existing.plugGapMm, unit),
  };
}

export function planToForm(p: Plan, unit: GapUnit): PlanForm {
  return {
    name: p.name,
    notes: p.notes,
    moduleId: idText(p.moduleId),
    coilId: idText(p.coilId),
    ballastId: idText(p.ballastId),
    crankingBypass: p.crankingBypass,
    moduleFeed: p.moduleFeed,
    coilWiring: p.coilWiring ?? 'as-marked-for-earth',
    tachId: idText(p.tachId),
    leadsId: idText(p.leadsId),
    plugId: idText(p.plugId),
    plugGap: gapFromMm(p.plugGapMm, unit),
  };
}

/** "Make this a plan": the suggestion's module, coil, ballast, bypass and any shelf tach, leads or plugs, the rest as fitted now. */
export function suggestionToForm(s: ShelfSuggestion, engine: Engine, unit: GapUnit): PlanForm {
  return {
    ...blankPlanForm(engine, unit),
    name: s.planName,
    notes: `From the parts-bin search: ranked ${s.rank}.`,
    moduleId: String(s.moduleId),
    coilId: String(s.coilId),
    ballastId: idText(s.ballastId),
    crankingBypass: s.ballastId !== null && s.crankingBypass,
    tachId: idText(s.tachId),
    leadsId: idText(s.leadsId),
    plugId: idText(s.plugId),
    plugGap: gapFromMm(s.setup.plugGapMm, unit),
  };
}

export type PlanCheck = { ok: true; input: PlanInput } | { ok: false; errors: Record<string, string> };

export function formToPlanInput(f: PlanForm, engineId: number, status: PlanStatus): PlanCheck {
  const errors: Record<string, string> = {};
  const gap = parseNumberText(f.plugGap.text, 'Plug gap');
  if (!gap.ok) errors.plugGapMm = gap.message;
  const candidate = {
    engineId,
    name: f.name,
    notes: f.notes,
    status,
    moduleId: idOf(f.moduleId),
    coilId: idOf(f.coilId),
    ballastId: idOf(f.ballastId),
    // A bypass only means something with a ballast to bypass.
    crankingBypass: f.ballastId !== '' && f.crankingBypass,
    moduleFeed: f.moduleFeed,
    coilWiring: f.coilWiring,
    tachId: idOf(f.tachId),
    leadsId: idOf(f.leadsId),
    plugId: idOf(f.plugId),
    plugGapMm: f.plugGap.mm ?? Number.NaN,
  };
  const parsed = planInput.safeParse(candidate);
  if (!parsed.success) {
    for (const [k, v] of Object.entries(fieldMessages(parsed.error))) if (!(k in errors)) errors[k] = v;
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { ok: false, errors };
  return { ok: true, input: parsed.data };
}

/** For "has anything changed?": the gap compared by its millimetres, not its text. */
export function planFingerprint(f: PlanForm): string {
  return JSON.stringify({ ...f, plugGap: f.plugGap.mm === null ? `text:${f.plugGap.text}` : `mm:${numberToText(f.plugGap.mm, 6)}` });
}
