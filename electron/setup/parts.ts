/**
 * Stored parts (db/schema types, millimetres and microfarads) to the checker's part specs (SI).
 * A measured reading wins over the catalogue value and is marked 'measured'.
 */
import type { Ballast, Coil, IgnitionModule, Leads, Part, Plug, Reading, Tach } from '../../db/schema.js';
import type { BallastSpec, CoilSpec, ModuleSpec, LeadsSpec, PlugSpec, TachSpec } from '../checker/types.js';
import { copperResistanceAt20COhm } from '../checker/primary.js';
import { SetupAdapterError } from './errors.js';

/** The most recent reading of a quantity (latest date; the later entry on a tie), if any. */
export function latestReading(readings: readonly Reading[] | undefined, quantity: Reading['quantity']): Reading | undefined {
  let best: Reading | undefined;
  for (const r of readings ?? []) {
    if (r.quantity !== quantity || !Number.isFinite(r.value)) continue;
    if (!best || r.takenOn > best.takenOn || (r.takenOn === best.takenOn && r.id > best.id)) best = r;
  }
  return best;
}

/**
 * A coil. A measured primary resistance is taken at the bench temperature `readAtC` (the ambient
 * condition) and corrected to 20 degC with the copper law.
 */
export function coilSpec(c: Coil, readings?: readonly Reading[], readAtC = 20): CoilSpec {
  const measured = latestReading(readings, 'coil-primary-resistance');
  return {
    name: c.name,
    primaryResistanceOhm20C:
      measured && measured.value > 0
        ? { value: copperResistanceAt20COhm(measured.value, readAtC), provenance: 'measured' }
        : { value: c.primaryResistanceOhm20C, provenance: 'catalogue' },
    primaryInductanceH: c.primaryInductanceH,
    secondaryResistanceOhm: c.secondaryResistanceOhm,
    turnsRatio: c.turnsRatio,
    secondaryInductanceH: c.secondaryInductanceH,
    forBallast: c.forBallast,
    ratedVoltageV: c.ratedVoltageV,
    maxDissipationW: c.maxDissipationW,
    ratedSecondaryV: c.ratedSecondaryKv != null ? c.ratedSecondaryKv * 1000 : null,
    couplingK: c.couplingK ?? null,
  };
}

export function ballastSpec(b: Ballast, readings?: readonly Reading[]): BallastSpec {
  const measured = latestReading(readings, 'ballast-resistance');
  return {
    name: b.name,
    ballastType: b.ballastType,
    coldResistanceOhm: measured && measured.value > 0 ? { value: measured.value, provenance: 'measured' } : { value: b.coldResistanceOhm, provenance: 'catalogue' },
    thermalResistanceKPerW: b.thermalResistanceKPerW,
  };
}

/** A resistive harness wire fitted instead of a discrete ballast, when no part describes it (from memory). */
export function defaultHarnessWire(): BallastSpec {
  return { name: 'Resistive harness wire (assumed)', ballastType: 'harness-wire', coldResistanceOhm: { value: 1.5, provenance: 'default (from memory)' }, thermalResistanceKPerW: null };
}

export function moduleSpec(m: IgnitionModule): ModuleSpec {
  return {
    name: m.name,
    moduleType: m.moduleType,
    supplyMinV: m.supplyMinV,
    supplyMaxV: m.supplyMaxV,
    cutOutV: null,
    earthPolarities: [...m.earthPolarities],
    minCoilResistanceOhm: m.minCoilResistanceOhm,
    maxCurrentA: m.maxCurrentA,
    currentLimitA: m.currentLimitA,
    switchSaturationV: m.switchSaturationV,
    primaryClampV: m.primaryClampV,
    fixedDutyFraction: m.fixedDutyFraction,
    maxDutyFraction: m.maxDutyFraction,
    stallShutOff: m.stallShutOff,
    maxSparkRateHz: m.maxSparkRateHz,
    tachOutput: m.tachOutput,
    needsSuppressedLeads: m.needsSuppressedLeads,
    cd: m.cd
      ? { capacitorF: m.cd.capacitorUf * 1e-6, chargeVoltageV: m.cd.chargeVoltageV, chargerPowerW: m.cd.chargerPowerW, multiSparkBelowRpm: m.cd.multiSparkBelowRpm }
      : null,
  };
}

export const tachSpec = (t: Tach): TachSpec => ({ name: t.name, senses: t.senses });
/**
 * HT leads. A measured lead resistance (stored in kohm, end to end of one lead) wins over the
 * catalogue figure per lead, converted to the checker's ohm.
 */
export function leadsSpec(l: Leads, readings?: readonly Reading[]): LeadsSpec {
  const measured = latestReading(readings, 'ht-lead-resistance');
  return measured && measured.value >= 0
    ? { name: l.name, core: l.core, resistancePerLeadOhm: measured.value * 1000, resistanceProvenance: 'measured' }
    : { name: l.name, core: l.core, resistancePerLeadOhm: l.resistancePerLeadOhm, resistanceProvenance: 'catalogue' };
}
export const plugSpec = (p: Plug): PlugSpec => ({ name: p.name, resistor: p.resistor, resistorOhm: p.resistorOhm, gapMinM: p.gapMinMm / 1000, gapMaxM: p.gapMaxMm / 1000 });

/** Look a part up by id and kind, with a plain error when it is missing or of another kind. */
export function partOf<K extends Part['kind']>(parts: readonly Part[], id: number, kind: K, role: string): Extract<Part, { kind: K }> {
  const p = parts.find((x) => x.id === id);
  if (!p) throw new SetupAdapterError('NOT_FOUND', `The ${role} (part ${id}) is not in the parts list.`);
  if (p.kind !== kind) throw new SetupAdapterError('INVALID_INPUT', `Part ${id} is a ${p.kind}, but it is used as the ${role}.`);
  return p as Extract<Part, { kind: K }>;
}
