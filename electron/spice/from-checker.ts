/**
 * From the checker's report to the circuit the exporter draws: the checker's resolved values at
 * one rpm (`circuitAtRpm`) plus the few switch facts that live on the setup (current limit,
 * clamp). The total primary resistance is exactly the checker's; it is only split into its parts
 * (winding, ballast, feed, contacts) so the deck reads like the car.
 */
import { circuitAtRpm } from '../checker/index.js';
import type { SetupReport, SetupSpec } from '../checker/index.js';
import type { SpiceCircuit } from './circuit.js';

export class ExportError extends Error {
  readonly code = 'CANNOT_EXPORT';
  constructor(message: string) {
    super(message);
    this.name = 'ExportError';
  }
}

/** The current limit the checker applies at the break, or null when the switch does not limit. */
export function switchCurrentLimitA(spec: SetupSpec): number | null {
  const m = spec.module;
  if (!m) return null;
  if (spec.switching === 'breakerless-current-limited') return m.currentLimitA ?? m.maxCurrentA;
  return m.currentLimitA !== null && m.currentLimitA > 0 ? m.currentLimitA : null;
}

/** The circuit of `spec` at `rpm`, as resolved in its checker `report`. */
export function circuitFromReport(spec: SetupSpec, report: SetupReport, rpm: number, title?: string): SpiceCircuit {
  if (spec.switching === 'magneto') {
    throw new ExportError('A magneto makes its own current in a rotating armature; the deck exporter covers battery-fed coils only.');
  }
  if (!(Number.isFinite(rpm) && rpm > 0)) throw new ExportError('The rpm must be a number above zero.');
  const at = circuitAtRpm(report, rpm);
  const c = report.circuit;
  const point = report.points.reduce((best, p) => (Math.abs(p.rpm - rpm) < Math.abs(best.rpm - rpm) ? p : best), report.points[0]!);
  const cranking = point.supplyCase === 'cranking';
  const coilOhm = cranking ? c.coilResistanceColdOhm : c.coilResistanceHotOhm;
  // Whatever of the checker's total is not winding, feed or contacts is the ballast at its
  // temperature at this rpm (zero when there is none, or when the cranking bypass removes it).
  const rest = at.primaryResistanceOhm - coilOhm - c.harnessResistanceOhm - c.contactResistanceOhm;
  const ballastOhm = rest > 1e-9 ? rest : 0;
  const windingOhm = rest > 1e-9 ? coilOhm : Math.max(at.primaryResistanceOhm - c.harnessResistanceOhm - c.contactResistanceOhm, 1e-3);
  const isCd = spec.switching === 'capacitive-discharge';
  return {
    title: title ?? `${report.label} at ${Math.round(rpm)} rpm (${cranking ? 'cranking' : 'running'} supply)`,
    primary: {
      supplyV: at.supplyV,
      harnessResistanceOhm: c.harnessResistanceOhm,
      ballastResistanceOhm: ballastOhm,
      coilResistanceOhm: windingOhm,
      primaryInductanceH: at.primaryInductanceH,
      contactResistanceOhm: c.contactResistanceOhm,
      switchDropV: at.switchDropV,
      currentLimitA: switchCurrentLimitA(spec),
      dwellS: at.dwellTimeS,
      condenserF: at.condenserF > 0 ? at.condenserF : null,
      primaryClampV: at.primaryClampV,
    },
    secondary: {
      turnsRatio: at.turnsRatio,
      secondaryCapacitanceF: at.secondaryCapacitanceF,
      secondaryResistanceOhm: at.secondaryResistanceOhm,
    },
    cd: isCd && at.cd ? { capacitorF: at.cd.capacitorF, chargeVoltageV: at.cd.chargeVoltageV } : null,
    // The coupling the checker used: the coil's own when its maker gives one, else the engine's condition.
    couplingK: c.couplingK,
  };
}
