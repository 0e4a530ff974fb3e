/**
 * The cranking path, the one part of a prepared setup that the cranking bypass changes: while the
 * starter turns, the battery sags and the bypass (if fitted) feeds the coil past the ballast.
 * Kept apart so that the parts-bin search can give a ballast combination's bypass twin its own
 * cranking path without solving the ballast heating again.
 */
import { finalCurrentA } from './primary.js';
import type { PreparedSetup } from './prepare.js';
import type { ModuleSpec, ResolvedConditions, SetupSpec, SwitchingKind } from './types.js';

/**
 * Supply a module sees when it is the only load on its feed (a CD charger drawing P): the feed
 * resistance R drops it, V_m = V - R P / V_m, so V_m = (V + sqrt(V^2 - 4 R P)) / 2; when the
 * feed cannot deliver P at all the supply collapses to about V / 2.
 */
export function supplyUnderPowerLoadV(supplyV: number, feedOhm: number, powerW: number): number {
  const disc = supplyV * supplyV - 4 * feedOhm * powerW;
  return disc > 0 ? 0.5 * (supplyV + Math.sqrt(disc)) : 0.5 * supplyV;
}

/** What the cranking bypass changes: the circuit the coil and module see while the starter turns. */
interface CrankingPath {
  rCrankingOhm: number;
  iFinalCrankingA: number;
  tauCrankingS: number;
  moduleSupplyCrankingV: number | null;
}

/**
 * The cranking path: cold coil, harness and contact, plus the cold ballast unless the bypass feeds
 * the coil straight from the starter circuit. `m` is the module when the setup switches with one. The module's own supply sags with the feed's drop
 * (fed after the ballast it also loses the ballast drop, unless the bypass lifts that side).
 */
export function crankingPath(setup: SetupSpec, m: ModuleSpec | null, kind: SwitchingKind, crankV: number, coilCold: number, harness: number, contact: number, bCold: number, switchDrop: number, lp: number): CrankingPath {
  const b = setup.ballast;
  const withBallastCranking = b !== null && !setup.crankingBypass;
  const rCranking = coilCold + harness + contact + (withBallastCranking ? bCold : 0);
  const iCrank = finalCurrentA(crankV, switchDrop, rCranking);
  let supplyV: number | null = null;
  if (m) {
    const afterBallast = setup.moduleFeed === 'after-ballast' && b !== null;
    // With a cranking bypass the coil side of the ballast is fed from the starter circuit.
    const feedCrank = harness + (afterBallast && !setup.crankingBypass ? bCold : 0);
    supplyV = kind === 'capacitive-discharge' && m.cd ? supplyUnderPowerLoadV(crankV, feedCrank, m.cd.chargerPowerW) : Math.max(0, crankV - feedCrank * iCrank);
  }
  return {
    rCrankingOhm: rCranking,
    iFinalCrankingA: kind === 'magneto' ? 0 : iCrank,
    tauCrankingS: lp / Math.max(1e-6, rCranking),
    moduleSupplyCrankingV: supplyV,
  };
}

/** The cranking supply as the circuit uses it, 9.6 V if unusable (the prepared `crankingSupplyV` reads 0 for a magneto). */
export function crankingSupplyOf(c: ResolvedConditions): number {
  const v = c.crankingSupplyV.value;
  return Number.isFinite(v) && v >= 0 ? v : 9.6;
}

/**
 * The same setup with the cranking bypass changed: `setup` must be `p.spec` with only
 * `crankingBypass` different. Nothing else depends on the bypass (the ballast heats up while
 * running, when the bypass is open), so only the cranking path is worked out again; the result is
 * what `prepareSetup(engine, setup, c, model)` gives, without solving the ballast heating twice.
 */
export function withCrankingBypass(p: PreparedSetup, setup: SetupSpec, c: ResolvedConditions): PreparedSetup {
  const m = p.kind === 'points' || p.kind === 'magneto' ? null : setup.module;
  const crank = crankingPath(setup, m, p.kind, crankingSupplyOf(c), p.coilColdOhm, p.harnessOhm, p.contactOhm, p.ballastColdOhm, p.switchDropV, p.primaryInductanceH);
  // Field by field, in the order `prepareSetup` builds them: the sweep then meets one object
  // shape only (a spread copy gets a shape of its own, and a sweep fed both runs nearly twice as slow).
  return {
    mode: p.mode,
    camFraction: p.camFraction,
    floatRpm: p.floatRpm,
    fixedDuty: p.fixedDuty,
    maxDuty: p.maxDuty,
    holdS: p.holdS,
    limitA: p.limitA,
    spec: setup,
    kind: p.kind,
    issues: [...p.issues],
    model: p.model,
    switchDropV: p.switchDropV,
    runningSupplyV: p.runningSupplyV,
    crankingSupplyV: p.crankingSupplyV,
    restingSupplyV: p.restingSupplyV,
    coilColdOhm: p.coilColdOhm,
    coilHotOhm: p.coilHotOhm,
    ballastColdOhm: p.ballastColdOhm,
    ballastHotOhm: p.ballastHotOhm,
    ballastHotK: p.ballastHotK,
    ballastColdK: p.ballastColdK,
    harnessOhm: p.harnessOhm,
    contactOhm: p.contactOhm,
    rRunningOhm: p.rRunningOhm,
    rCrankingOhm: crank.rCrankingOhm,
    rColdOhm: p.rColdOhm,
    iFinalRunningA: p.iFinalRunningA,
    iFinalCrankingA: crank.iFinalCrankingA,
    iFinalRestingA: p.iFinalRestingA,
    tauRunningS: p.tauRunningS,
    tauCrankingS: crank.tauCrankingS,
    primaryInductanceH: p.primaryInductanceH,
    condenserF: p.condenserF,
    secondaryCapacitanceF: p.secondaryCapacitanceF,
    effectiveCapacitanceF: p.effectiveCapacitanceF,
    n: p.n,
    secondaryInductanceH: p.secondaryInductanceH,
    secondaryResistanceOhm: p.secondaryResistanceOhm,
    eta: p.eta,
    clampV: p.clampV,
    capV: p.capV,
    clampCapV: p.clampCapV,
    ceilingV: p.ceilingV,
    ceilingProvenance: p.ceilingProvenance,
    peakVPerA: p.peakVPerA,
    dampingFactor: p.dampingFactor,
    couplingK: p.couplingK,
    arcV: p.arcV,
    fouledShuntOhm: p.fouledShuntOhm,
    voltsPerAmp: p.voltsPerAmp,
    fouledVPerA: p.fouledVPerA,
    riseS: p.riseS,
    polarityFactor: p.polarityFactor,
    moduleSupplyRunningV: p.moduleSupplyRunningV,
    moduleSupplyCrankingV: crank.moduleSupplyCrankingV,
    moduleSupplyRestingV: p.moduleSupplyRestingV,
    ironBallast: p.ironBallast,
    cd: p.cd,
    magnetoRatedA: p.magnetoRatedA,
    magnetoFullRpm: p.magnetoFullRpm,
  };
}
