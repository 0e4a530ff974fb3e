/**
 * The engine form as the person sees it: every number is kept as the text they typed, so a
 * half-typed "0," or a blank never turns into NaN. `formToInput` reads the text back into an
 * `EngineInput` and checks it with the same zod schema the store uses, returning messages keyed
 * by the schema's paths ("existing.plugGapMm", "advanceCurve.2.rpm").
 */
import { conditionDescriptors, conditionKeys, engineInput, fieldMessages, toStored, toTyped, type CoilWiringChoice, type ConditionKey, type Engine, type EngineInput } from '../../../db/schema.js';
import { numberToText, parseNumberText, parseOptionalNumberText } from '../../app/numbers.js';
import { gapFromMm, gapPrint, type GapValue } from '../../app/gaps.js';
import type { GapUnit } from '../../app/units.js';
import { checkInOnePass } from '../../app/one-pass.js';

export type CurveRow = { key: number; rpm: string; advanceDeg: string };

export type EngineForm = {
  name: string;
  yearText: string;
  modelText: string;
  notes: string;
  cylinders: string;
  cycle: EngineInput['cycle'];
  firingOrder: string;
  boreMm: string;
  strokeMm: string;
  conRodMm: string;
  compressionRatio: string;
  crankingRpm: string;
  idleRpm: string;
  redlineRpm: string;
  systemVoltageV: '6' | '12';
  earthPolarity: EngineInput['earthPolarity'];
  charging: EngineInput['charging'];
  pointsDwellDeg: string;
  pointsGap: GapValue;
  staticTimingDegBtdc: string;
  pointsFloatRpm: string;
  advanceCurve: CurveRow[];
  existing: {
    trigger: EngineInput['existing']['trigger'];
    coilPartId: string;
    ballast: EngineInput['existing']['ballast'];
    ballastPartId: string;
    crankingBypass: boolean;
    coilWiring: CoilWiringChoice;
    condenserUf: string;
    tachPartId: string;
    leadsPartId: string;
    plugPartId: string;
    plugGap: GapValue;
    magnetoRatedCurrentA: string;
    magnetoFullOutputRpm: string;
  };
  conditions: Record<ConditionKey, string>;
};

/** Every working condition as typed (in the unit its descriptor shows: kPa, pF, ms ...); blank = the default. */
const blankConditions = (): Record<ConditionKey, string> => Object.fromEntries(conditionKeys.map((k) => [k, ''])) as Record<ConditionKey, string>;

let rowKey = 1;
export const nextRowKey = (): number => rowKey++;

const idText = (v: number | null): string => (v === null ? '' : String(v));

/**
 * Starting values for a new engine: a four-cylinder four-stroke with the speeds, dwell, gaps and
 * timing common in workshop manuals of the points era (common practice). Geometry is left blank
 * because it is different for every engine and a guess there would quietly skew every check.
 */
export function blankForm(unit: GapUnit): EngineForm {
  return {
    name: '',
    yearText: '',
    modelText: '',
    notes: '',
    cylinders: '4',
    cycle: 'four-stroke',
    firingOrder: '1-3-4-2',
    boreMm: '',
    strokeMm: '',
    conRodMm: '',
    compressionRatio: '',
    crankingRpm: '200',
    idleRpm: '800',
    redlineRpm: '6000',
    systemVoltageV: '12',
    earthPolarity: 'negative',
    charging: 'dynamo',
    pointsDwellDeg: '54',
    pointsGap: gapFromMm(0.38, unit),
    staticTimingDegBtdc: '8',
    pointsFloatRpm: '',
    advanceCurve: [],
    existing: {
      trigger: 'points',
      coilPartId: '',
      ballast: 'none',
      ballastPartId: '',
      crankingBypass: false,
      coilWiring: 'as-marked-for-earth',
      condenserUf: '0.22',
      tachPartId: '',
      leadsPartId: '',
      plugPartId: '',
      plugGap: gapFromMm(0.6, unit),
      magnetoRatedCurrentA: '',
      magnetoFullOutputRpm: '',
    },
    conditions: blankConditions(),
  };
}

export function engineToForm(e: Engine, unit: GapUnit): EngineForm {
  const n = (v: number | null | undefined): string => numberToText(v, 6);
  const c = e.conditions;
  return {
    name: e.name,
    yearText: e.yearText,
    modelText: e.modelText,
    notes: e.notes,
    cylinders: n(e.cylinders),
    cycle: e.cycle,
    firingOrder: e.firingOrder,
    boreMm: n(e.boreMm),
    strokeMm: n(e.strokeMm),
    conRodMm: n(e.conRodMm),
    compressionRatio: n(e.compressionRatio),
    crankingRpm: n(e.crankingRpm),
    idleRpm: n(e.idleRpm),
    redlineRpm: n(e.redlineRpm),
    systemVoltageV: e.systemVoltageV === 6 ? '6' : '12',
    earthPolarity: e.earthPolarity,
    charging: e.charging,
    pointsDwellDeg: n(e.pointsDwellDeg),
    pointsGap: gapFromMm(e.pointsGapMm, unit),
    staticTimingDegBtdc: n(e.staticTimingDegBtdc),
    pointsFloatRpm: n(e.pointsFloatRpm),
    advanceCurve: e.advanceCurve.map((p) => ({ key: nextRowKey(), rpm: n(p.rpm), advanceDeg: n(p.advanceDeg) })),
    existing: {
      trigger: e.existing.trigger,
      coilPartId: idText(e.existing.coilPartId),
      ballast: e.existing.ballast,
      ballastPartId: idText(e.existing.ballastPartId),
      crankingBypass: e.existing.crankingBypass,
      coilWiring: e.existing.coilWiring ?? 'as-marked-for-earth',
      condenserUf: n(e.existing.condenserUf),
      tachPartId: idText(e.existing.tachPartId),
      leadsPartId: idText(e.existing.leadsPartId),
      plugPartId: idText(e.existing.plugPartId),
      plugGap: gapFromMm(e.existing.plugGapMm, unit),
      magnetoRatedCurrentA: n(e.existing.magnetoRatedCurrentA),
      magnetoFullOutputRpm: n(e.existing.magnetoFullOutputRpm),
    },
    conditions: Object.fromEntries(
      conditionDescriptors.map((d) => {
        const v = c[d.key];
        return [d.key, v === undefined ? '' : n(toTyped(d, v))];
      }),
    ) as Record<ConditionKey, string>,
  };
}

/** The labels used in "must be a number" messages, by schema path. */
export const numberLabels: Record<string, string> = {
  cylinders: 'Cylinders',
  boreMm: 'Bore',
  strokeMm: 'Stroke',
  conRodMm: 'Connecting-rod length',
  compressionRatio: 'Compression ratio',
  crankingRpm: 'Cranking speed',
  idleRpm: 'Idle speed',
  redlineRpm: 'Redline',
  pointsDwellDeg: 'Dwell angle',
  pointsGapMm: 'Points gap',
  staticTimingDegBtdc: 'Static timing',
  pointsFloatRpm: 'Points float rpm',
  'existing.condenserUf': 'Condenser',
  'existing.plugGapMm': 'Plug gap',
  'existing.magnetoRatedCurrentA': 'Magneto rated current',
  'existing.magnetoFullOutputRpm': 'Magneto full-output rpm',
  ...Object.fromEntries(conditionDescriptors.map((d) => [`conditions.${d.key}`, d.label])),
};

export type FormCheck = { ok: true; input: EngineInput } | { ok: false; errors: Record<string, string> };

/** A curve row with nothing typed in either box is not part of the curve (a row just added). */
const blankRow = (r: CurveRow): boolean => r.rpm.trim() === '' && r.advanceDeg.trim() === '';

/**
 * Reads the form into an EngineInput and checks it exactly as the store will, every check in one
 * pass (app/one-pass.ts): a cross-field message shows beside a letter typed in another box. Curve
 * rows left wholly blank are left out; messages keep the row numbers the form shows.
 */
export function formToInput(f: EngineForm): FormCheck {
  const own: Record<string, string> = {};
  // Rows sent, by their place in the form (blank rows skipped), so the store's paths map back.
  const rowsSent = f.advanceCurve.map((r, i) => (blankRow(r) ? -1 : i)).filter((i) => i >= 0);
  const build = (standIn: number): unknown => {
    const num = (path: string, text: string): number => {
      const p = parseNumberText(text, numberLabels[path] ?? 'This value');
      if (p.ok) return p.value;
      own[path] = p.message;
      return standIn; // never sent: the message above stops the save
    };
    const opt = (path: string, text: string): number | null => {
      const p = parseOptionalNumberText(text, numberLabels[path] ?? 'This value');
      if (p.ok) return p.value;
      own[path] = p.message;
      return standIn;
    };
    const gap = (path: string, g: GapValue): number => {
      if (g.mm !== null) return g.mm;
      const p = parseNumberText(g.text, numberLabels[path] ?? 'Gap');
      own[path] = p.ok ? `${numberLabels[path] ?? 'Gap'} could not be read.` : p.message;
      return standIn;
    };
    const partId = (v: string): number | null => (v === '' ? null : Number(v));
    const magneto = f.existing.trigger === 'magneto';
    const conditions: Record<string, number> = {};
    for (const d of conditionDescriptors) {
      const v = opt(`conditions.${d.key}`, f.conditions[d.key]);
      if (v !== null) conditions[d.key] = toStored(d, v);
    }
    return {
      name: f.name,
      yearText: f.yearText.trim(),
      modelText: f.modelText.trim(),
      notes: f.notes,
      cylinders: num('cylinders', f.cylinders),
      cycle: f.cycle,
      firingOrder: f.firingOrder.trim().replace(/\s*-\s*/g, '-'),
      boreMm: num('boreMm', f.boreMm),
      strokeMm: num('strokeMm', f.strokeMm),
      conRodMm: num('conRodMm', f.conRodMm),
      compressionRatio: num('compressionRatio', f.compressionRatio),
      idleRpm: num('idleRpm', f.idleRpm),
      crankingRpm: num('crankingRpm', f.crankingRpm),
      redlineRpm: num('redlineRpm', f.redlineRpm),
      systemVoltageV: f.systemVoltageV === '6' ? 6 : 12,
      earthPolarity: f.earthPolarity,
      charging: f.charging,
      pointsDwellDeg: num('pointsDwellDeg', f.pointsDwellDeg),
      pointsGapMm: gap('pointsGapMm', f.pointsGap),
      pointsFloatRpm: opt('pointsFloatRpm', f.pointsFloatRpm),
      staticTimingDegBtdc: num('staticTimingDegBtdc', f.staticTimingDegBtdc),
      advanceCurve: rowsSent.map((i) => ({
        rpm: num(`advanceCurve.${i}.rpm`, f.advanceCurve[i]!.rpm),
        advanceDeg: num(`advanceCurve.${i}.advanceDeg`, f.advanceCurve[i]!.advanceDeg),
      })),
      existing: {
        trigger: f.existing.trigger,
        coilPartId: partId(f.existing.coilPartId),
        ballast: f.existing.ballast,
        ballastPartId: f.existing.ballast === 'none' ? null : partId(f.existing.ballastPartId),
        crankingBypass: f.existing.ballast === 'none' ? false : f.existing.crankingBypass,
        coilWiring: magneto ? 'as-marked-for-earth' : f.existing.coilWiring,
        condenserUf: opt('existing.condenserUf', f.existing.condenserUf),
        tachPartId: partId(f.existing.tachPartId),
        leadsPartId: partId(f.existing.leadsPartId),
        plugPartId: partId(f.existing.plugPartId),
        plugGapMm: gap('existing.plugGapMm', f.existing.plugGap),
        magnetoRatedCurrentA: magneto ? opt('existing.magnetoRatedCurrentA', f.existing.magnetoRatedCurrentA) : null,
        magnetoFullOutputRpm: magneto ? opt('existing.magnetoFullOutputRpm', f.existing.magnetoFullOutputRpm) : null,
      },
      conditions,
    };
  };
  const toMessages = (error: Parameters<typeof fieldMessages>[0]): Record<string, string> => {
    const out: Record<string, string> = {};
    for (const [path, message] of Object.entries(fieldMessages(error))) {
      // The schema counts only the rows sent; the form's row numbers include blank ones.
      const row = /^advanceCurve\.(\d+)(\..*)?$/.exec(path);
      const shownPath = row ? `advanceCurve.${rowsSent[Number(row[1])] ?? row[1]}${row[2] ?? ''}` : path;
      // A condition's range names the plan file's SI key too; beside a box typed in kPa or pF that is noise.
      out[shownPath] = path.startsWith('conditions.') ? message.replace(/ \(in the file, [^)]*\)/, '') : message;
    }
    return out;
  };
  return checkInOnePass(engineInput, build, own, toMessages);
}

/** A fingerprint for "has anything changed?": gaps compared by their millimetres, not their text. */
export function formFingerprint(f: EngineForm): string {
  return JSON.stringify({
    ...f,
    pointsGap: gapPrint(f.pointsGap),
    advanceCurve: f.advanceCurve.map((r) => [r.rpm, r.advanceDeg]),
    existing: { ...f.existing, plugGap: gapPrint(f.existing.plugGap) },
  });
}
