/**
 * The report's figures beyond the sweep columns: per point, the spark energy delivered to the arc
 * and the secondary ceiling; per setup, what a restorer would otherwise work out by hand (time to
 * reach the current limit, CD recharge time and the rpm where CD energy starts to fall, how much
 * the coil coupling moves a CD peak, the cylinder state at the spark at each key speed).
 */
import { cdEnergyFallsFromRpm, cdSecondaryPeakV, cdSparkEnergyJ, leakageInductanceH, rechargeTimeS } from './cd.js';
import { timeToReachS } from './charge.js';
import type { EngineGrids, RpmGrid } from './grid.js';
import type { PreparedSetup } from './prepare.js';
import { inductiveSparkEnergyGivenDurationJ } from './secondary.js';
import type { Workspace } from './sweep.js';
import type { EngineSpec, Figure } from './types.js';

const fin = (x: number): number => (Number.isFinite(x) ? x : 0);

/** Energy delivered to the arc at point i: inductive from the secondary current, CD from the charge voltage. */
export function sparkEnergyAt(p: PreparedSetup, ws: Workspace, i: number): number {
  if (!(ws.availableV[i]! > 0)) return 0;
  if (p.cd) return cdSparkEnergyJ(p.cd.capacitorF, ws.cdChargeV[i]!, p.n, p.arcV, p.eta);
  return inductiveSparkEnergyGivenDurationJ(p.secondaryInductanceH, p.secondaryResistanceOhm, (p.eta * ws.currentA[i]!) / p.n, p.arcV, ws.durationS[i]!);
}

const KEY_NAMES = ['cranking', 'idle', 'mid-range', 'redline'] as const;

/** Figures per setup, in the units a restorer reads (ms, rpm, kV, bar, degC). */
export function setupFigures(engine: EngineSpec, grids: EngineGrids, p: PreparedSetup, ws: Workspace, keyWs: Workspace): Figure[] {
  const out: Figure[] = [];
  const f = (name: string, value: number, unit: string): void => {
    out.push({ name, value: fin(value), unit });
  };
  // With where it came from: the coil's rating, the engine's value, or the default for the kind (from memory).
  out.push({ name: 'coil secondary ceiling (insulation rating)', value: fin(p.ceilingV / 1000), unit: 'kV', provenance: p.ceilingProvenance });
  let capped = 0;
  for (let i = 0; i < ws.n; i++) if (ws.uncappedV[i]! > p.ceilingV) capped++;
  f('sweep points capped at the ceiling', capped, '');
  if (p.kind !== 'capacitive-discharge' && p.kind !== 'magneto') f('secondary resistance takes off the peak', (1 - p.dampingFactor) * 100, '%');
  if (p.limitA < Infinity && p.kind !== 'capacitive-discharge') {
    // At idle on the running supply (the ballast, if any, at its idle temperature), and cranking.
    // Where the final current stays under the limit the limit is never reached: say so with that current.
    const toLimit = (label: string, finalA: number, tauS: number): void => {
      const t = timeToReachS(finalA, tauS, p.limitA);
      if (Number.isFinite(t)) f(`time to reach the current limit, ${label}`, t * 1000, 'ms');
      else f(`current limit not reached, ${label}: the final current`, finalA, 'A');
    };
    toLimit('idle', p.iFinalRunningA, p.tauRunningS);
    toLimit('cranking', p.iFinalCrankingA, p.tauCrankingS);
  }
  const cd = p.cd;
  if (cd) {
    f('CD recharge time at the nominal charge voltage', rechargeTimeS(cd.capacitorF, cd.nominalV, cd.chargerPowerW) * 1000, 'ms');
    f('CD energy starts to fall from', cdEnergyFallsFromRpm(cd.capacitorF, cd.nominalV, cd.chargerPowerW, engine.cylinders, engine.cycle === 'two-stroke'), 'rpm');
    f('CD rise time (transfer loop peak time)', cd.riseS * 1e6, 'us');
    // How much the coupling matters: the same peak (nominal charge, hot winding, before the ceiling) at both ends of 0.98 to 0.999.
    const peakAt = (k: number): number =>
      cdSecondaryPeakV(cd.capacitorF, cd.nominalV, p.n, p.secondaryCapacitanceF, p.eta, { loopOhm: p.coilHotOhm + p.secondaryResistanceOhm / (p.n * p.n), leakageH: leakageInductanceH(p.primaryInductanceH, k) });
    f('coil coupling used', p.couplingK, '');
    f('CD peak at the coupling used', peakAt(p.couplingK) / 1000, 'kV');
    f('CD peak at coupling 0.98', peakAt(0.98) / 1000, 'kV');
    f('CD peak at coupling 0.999', peakAt(0.999) / 1000, 'kV');
  }
  const kg: RpmGrid = grids.key;
  for (let k = 0; k < kg.n && k < KEY_NAMES.length; k++) {
    const name = KEY_NAMES[k]!;
    f(`cylinder pressure at the spark, ${name} (${Math.round(kg.rpm[k]!)} rpm)`, kg.pressurePa[k]! / 1e5, 'bar');
    f(`cylinder temperature at the spark, ${name}`, kg.temperatureK[k]! - 273.15, 'degC');
    if (p.spec.ballast) f(`ballast temperature, ${name}`, keyWs.ballastK[k]! - 273.15, 'degC');
  }
  if (p.spec.ballast && p.ironBallast) f('ballast temperature just after a long idle', p.ballastHotK - 273.15, 'degC');
  return out;
}
