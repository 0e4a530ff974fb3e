/**
 * The part form as the person sees it. Every number is the text they typed; the form holds the
 * fields of every kind at once, so switching the kind back and forth loses nothing typed.
 * `formToInput` reads the chosen kind's text into a `PartInput` (mH -> H, per cent -> fraction,
 * inch -> mm) and checks it with `partInput`, the schema the store uses, returning messages keyed
 * by the schema's paths ("primaryInductanceH", "cd.capacitorUf").
 */
import { partInput, type Ballast, type IgnitionModule, type Leads, type Part, type PartInput, type PartKind, type Tach } from '../../../db/schema.js';
import { numberToText, parseNumberText } from '../../app/numbers.js';
import type { GapUnit } from '../../app/units.js';
import { gapFromMm, gapPrint, regap, type GapValue } from '../../app/gaps.js';
import { fieldSpecs, plainMessage, toStored, toTyped } from './field-specs.js';
import { checkInOnePass } from '../../app/one-pass.js';
import type { z } from 'zod';

export type PartForm = {
  kind: PartKind;
  name: string;
  notes: string;
  /** How many are on the shelf, as typed. */
  quantity: string;
  coil: {
    primaryResistanceOhm20C: string;
    primaryInductanceH: string; // typed in mH
    secondaryResistanceOhm: string;
    turnsRatio: string;
    secondaryInductanceH: string;
    forBallast: boolean;
    ratedVoltageV: '6' | '12';
    maxDissipationW: string;
    ratedSecondaryKv: string;
    couplingK: string;
  };
  ballast: { ballastType: Ballast['ballastType']; coldResistanceOhm: string; thermalResistanceKPerW: string };
  module: {
    moduleType: IgnitionModule['moduleType'];
    supplyMinV: string;
    supplyMaxV: string;
    earthNegative: boolean;
    earthPositive: boolean;
    minCoilResistanceOhm: string;
    maxCurrentA: string;
    currentLimitA: string;
    switchSaturationV: string;
    primaryClampV: string;
    fixedDutyFraction: string; // typed in per cent
    maxDutyFraction: string; // typed in per cent
    stallShutOff: boolean;
    maxSparkRateHz: string;
    tachOutput: boolean;
    needsSuppressedLeads: boolean;
    cd: { capacitorUf: string; chargeVoltageV: string; chargerPowerW: string; multiSparkBelowRpm: string };
  };
  tach: { senses: Tach['senses'] };
  leads: { core: Leads['core']; resistancePerLeadOhm: string };
  plug: { resistor: boolean; resistorOhm: string; gapMin: GapValue; gapMax: GapValue };
};

/**
 * A new part starts with its figures blank: a guessed resistance or inductance would quietly skew
 * every check made with it. Only the yes/no and pick-one choices need a starting value.
 */
export function blankPartForm(kind: PartKind): PartForm {
  return {
    kind,
    name: '',
    notes: '',
    quantity: '1',
    coil: { primaryResistanceOhm20C: '', primaryInductanceH: '', secondaryResistanceOhm: '', turnsRatio: '', secondaryInductanceH: '', forBallast: false, ratedVoltageV: '12', maxDissipationW: '', ratedSecondaryKv: '', couplingK: '' },
    ballast: { ballastType: 'ceramic', coldResistanceOhm: '', thermalResistanceKPerW: '' },
    module: {
      moduleType: 'breakerless-current-limited',
      supplyMinV: '',
      supplyMaxV: '',
      earthNegative: true,
      earthPositive: false,
      minCoilResistanceOhm: '',
      maxCurrentA: '',
      currentLimitA: '',
      switchSaturationV: '',
      primaryClampV: '',
      fixedDutyFraction: '',
      maxDutyFraction: '',
      stallShutOff: true,
      maxSparkRateHz: '',
      tachOutput: false,
      needsSuppressedLeads: false,
      cd: { capacitorUf: '', chargeVoltageV: '', chargerPowerW: '', multiSparkBelowRpm: '' },
    },
    tach: { senses: 'coil-negative-pulses' },
    leads: { core: 'copper', resistancePerLeadOhm: '' },
    plug: { resistor: false, resistorOhm: '', gapMin: { text: '', mm: null }, gapMax: { text: '', mm: null } },
  };
}

/** A stored number as typed text, in the unit its field is typed in. */
const shown = (path: string, v: number | null | undefined, unit: GapUnit = 'mm'): string => {
  const spec = fieldSpecs[path];
  return v === null || v === undefined || !spec ? numberToText(v, 6) : numberToText(toTyped(spec, v, unit), 6);
};

export function partToForm(p: Part, unit: GapUnit): PartForm {
  const f = blankPartForm(p.kind);
  f.name = p.name;
  f.notes = p.notes;
  f.quantity = String(p.quantity);
  switch (p.kind) {
    case 'coil':
      f.coil = {
        primaryResistanceOhm20C: shown('primaryResistanceOhm20C', p.primaryResistanceOhm20C),
        primaryInductanceH: shown('primaryInductanceH', p.primaryInductanceH),
        secondaryResistanceOhm: shown('secondaryResistanceOhm', p.secondaryResistanceOhm),
        turnsRatio: shown('turnsRatio', p.turnsRatio),
        secondaryInductanceH: shown('secondaryInductanceH', p.secondaryInductanceH),
        forBallast: p.forBallast,
        ratedVoltageV: p.ratedVoltageV === 6 ? '6' : '12',
        maxDissipationW: shown('maxDissipationW', p.maxDissipationW),
        ratedSecondaryKv: shown('ratedSecondaryKv', p.ratedSecondaryKv ?? null),
        couplingK: shown('couplingK', p.couplingK ?? null),
      };
      break;
    case 'ballast':
      f.ballast = { ballastType: p.ballastType, coldResistanceOhm: shown('coldResistanceOhm', p.coldResistanceOhm), thermalResistanceKPerW: shown('thermalResistanceKPerW', p.thermalResistanceKPerW) };
      break;
    case 'module':
      f.module = {
        moduleType: p.moduleType,
        supplyMinV: shown('supplyMinV', p.supplyMinV),
        supplyMaxV: shown('supplyMaxV', p.supplyMaxV),
        earthNegative: p.earthPolarities.includes('negative'),
        earthPositive: p.earthPolarities.includes('positive'),
        minCoilResistanceOhm: shown('minCoilResistanceOhm', p.minCoilResistanceOhm),
        maxCurrentA: shown('maxCurrentA', p.maxCurrentA),
        currentLimitA: shown('currentLimitA', p.currentLimitA),
        switchSaturationV: shown('switchSaturationV', p.switchSaturationV),
        primaryClampV: shown('primaryClampV', p.primaryClampV),
        fixedDutyFraction: shown('fixedDutyFraction', p.fixedDutyFraction),
        maxDutyFraction: shown('maxDutyFraction', p.maxDutyFraction),
        stallShutOff: p.stallShutOff,
        maxSparkRateHz: shown('maxSparkRateHz', p.maxSparkRateHz),
        tachOutput: p.tachOutput,
        needsSuppressedLeads: p.needsSuppressedLeads,
        cd: {
          capacitorUf: shown('cd.capacitorUf', p.cd?.capacitorUf),
          chargeVoltageV: shown('cd.chargeVoltageV', p.cd?.chargeVoltageV),
          chargerPowerW: shown('cd.chargerPowerW', p.cd?.chargerPowerW),
          multiSparkBelowRpm: shown('cd.multiSparkBelowRpm', p.cd?.multiSparkBelowRpm),
        },
      };
      break;
    case 'tach':
      f.tach = { senses: p.senses };
      break;
    case 'leads':
      f.leads = { core: p.core, resistancePerLeadOhm: shown('resistancePerLeadOhm', p.resistancePerLeadOhm) };
      break;
    case 'plug':
      f.plug = { resistor: p.resistor, resistorOhm: shown('resistorOhm', p.resistorOhm), gapMin: gapFromMm(p.gapMinMm, unit), gapMax: gapFromMm(p.gapMaxMm, unit) };
      break;
  }
  return f;
}

/** Switching mm/inch re-shows the plug gaps; the stored millimetres stay as they were. */
export function regapForm(f: PartForm, unit: GapUnit): PartForm {
  return { ...f, plug: { ...f.plug, gapMin: regap(f.plug.gapMin, unit), gapMax: regap(f.plug.gapMax, unit) } };
}

export type FormCheck = { ok: true; input: PartInput } | { ok: false; errors: Record<string, string> };

/** Reads the chosen kind's fields and checks them exactly as the store will. */
export function formToInput(f: PartForm, unit: GapUnit): FormCheck {
  const own: Record<string, string> = {};
  const label = (path: string): string => fieldSpecs[path]?.label ?? 'This value';
  // Read twice when a box is unreadable (app/one-pass.ts), so the cross-field checks still run.
  const build = (standIn: number): unknown => {
    const num = (path: string, text: string): number => {
      const p = parseNumberText(text, label(path));
      if (!p.ok) {
        own[path] = p.message;
        return standIn; // never sent: the message above stops the save
      }
      const spec = fieldSpecs[path];
      return spec ? toStored(spec, p.value) : p.value;
    };
    const opt = (path: string, text: string): number | null => (text.trim() === '' ? null : num(path, text));
    const gap = (path: string, g: GapValue): number => {
      if (g.mm !== null) return g.mm;
      const p = parseNumberText(g.text, label(path));
      own[path] = p.ok ? `${label(path)} could not be read.` : p.message;
      return standIn;
    };
    const base = { name: f.name, notes: f.notes, quantity: num('quantity', f.quantity) };
    let candidate: unknown;
    switch (f.kind) {
      case 'coil': {
        const c = f.coil;
        candidate = {
          kind: 'coil',
          ...base,
          primaryResistanceOhm20C: num('primaryResistanceOhm20C', c.primaryResistanceOhm20C),
          primaryInductanceH: num('primaryInductanceH', c.primaryInductanceH),
          secondaryResistanceOhm: num('secondaryResistanceOhm', c.secondaryResistanceOhm),
          turnsRatio: opt('turnsRatio', c.turnsRatio),
          secondaryInductanceH: opt('secondaryInductanceH', c.secondaryInductanceH),
          forBallast: c.forBallast,
          ratedVoltageV: c.ratedVoltageV === '6' ? 6 : 12,
          maxDissipationW: opt('maxDissipationW', c.maxDissipationW),
          ratedSecondaryKv: opt('ratedSecondaryKv', c.ratedSecondaryKv),
          couplingK: opt('couplingK', c.couplingK),
        };
        break;
      }
      case 'ballast': {
        const b = f.ballast;
        candidate = {
          kind: 'ballast',
          ...base,
          ballastType: b.ballastType,
          coldResistanceOhm: num('coldResistanceOhm', b.coldResistanceOhm),
          thermalResistanceKPerW: opt('thermalResistanceKPerW', b.thermalResistanceKPerW),
        };
        break;
      }
      case 'module': {
        const m = f.module;
        const t = m.moduleType;
        // Fields that belong to another type of module are not sent; the ones this type needs are
        // read as required, so a blank gets "is needed" beside the box rather than a general refusal.
        candidate = {
          kind: 'module',
          ...base,
          moduleType: t,
          supplyMinV: num('supplyMinV', m.supplyMinV),
          supplyMaxV: num('supplyMaxV', m.supplyMaxV),
          earthPolarities: [...(m.earthNegative ? ['negative'] : []), ...(m.earthPositive ? ['positive'] : [])],
          minCoilResistanceOhm: num('minCoilResistanceOhm', m.minCoilResistanceOhm),
          maxCurrentA: num('maxCurrentA', m.maxCurrentA),
          currentLimitA: t === 'breakerless-current-limited' ? num('currentLimitA', m.currentLimitA) : null,
          switchSaturationV: num('switchSaturationV', m.switchSaturationV),
          primaryClampV: opt('primaryClampV', m.primaryClampV),
          fixedDutyFraction: t === 'breakerless-fixed-duty' ? num('fixedDutyFraction', m.fixedDutyFraction) : null,
          maxDutyFraction: t === 'breakerless-current-limited' ? num('maxDutyFraction', m.maxDutyFraction) : null,
          stallShutOff: m.stallShutOff,
          maxSparkRateHz: num('maxSparkRateHz', m.maxSparkRateHz),
          tachOutput: m.tachOutput,
          needsSuppressedLeads: m.needsSuppressedLeads,
          cd:
            t === 'capacitive-discharge'
              ? {
                  capacitorUf: num('cd.capacitorUf', m.cd.capacitorUf),
                  chargeVoltageV: num('cd.chargeVoltageV', m.cd.chargeVoltageV),
                  chargerPowerW: num('cd.chargerPowerW', m.cd.chargerPowerW),
                  multiSparkBelowRpm: opt('cd.multiSparkBelowRpm', m.cd.multiSparkBelowRpm),
                }
              : null,
        };
        break;
      }
      case 'tach':
        candidate = { kind: 'tach', ...base, senses: f.tach.senses };
        break;
      case 'leads':
        candidate = { kind: 'leads', ...base, core: f.leads.core, resistancePerLeadOhm: num('resistancePerLeadOhm', f.leads.resistancePerLeadOhm) };
        break;
      case 'plug': {
        const p = f.plug;
        candidate = {
          kind: 'plug',
          ...base,
          resistor: p.resistor,
          // A plug without a resistor has none: 0 ohm, not a figure left over from before.
          resistorOhm: p.resistor ? num('resistorOhm', p.resistorOhm) : 0,
          gapMinMm: gap('gapMinMm', p.gapMin),
          gapMaxMm: gap('gapMaxMm', p.gapMax),
        };
        break;
      }
    }
    return candidate;
  };
  const toMessages = (error: z.ZodError): Record<string, string> => {
    const out: Record<string, string> = {};
    for (const issue of error.issues) {
      const key = issue.path.map(String).join('.') || '_';
      if (!(key in out)) out[key] = plainMessage(issue, unit);
    }
    return out;
  };
  // Our own "type a number" messages win over zod's, which only sees the stand-in.
  return checkInOnePass(partInput, build, own, toMessages);
}

/** "Has anything changed?": only the chosen kind's fields count, and gaps by their millimetres. */
export function formFingerprint(f: PartForm): string {
  const own = f.kind === 'plug' ? { ...f.plug, gapMin: gapPrint(f.plug.gapMin), gapMax: gapPrint(f.plug.gapMax) } : f[f.kind];
  return JSON.stringify({ kind: f.kind, name: f.name, notes: f.notes, quantity: f.quantity, own });
}
