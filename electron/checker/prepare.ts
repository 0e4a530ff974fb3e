/**
 * Resolve one setup on one engine into the plain circuit numbers the sweep needs: resistances hot
 * and cold (with the iron ballast at its self-heated equilibrium), time constants, final currents,
 * secondary constants, the CD stage. Done once per setup so the rpm loop is arithmetic only.
 */
import { DEFAULT_COUPLING_K, kelvin, secondaryCeilingDefaultV, secondaryCeilingFor } from './conditions.js';
import { RunningBallast } from './ballast.js';
import { meanSquareCurrentA2 } from './charge.js';
import { REVERSED_POLARITY_FACTOR } from './breakdown.js';
import { cdRiseTimeS, cdSecondaryPeakV, cdSparkDurationS, leakageInductanceH } from './cd.js';
import { dwellFractionFromAngle } from './dwell.js';
import { parallelRlcPeakVPerA } from './fouled.js';
import { copperResistanceOhm, finalCurrentA } from './primary.js';
import { effectiveSecondaryCapacitanceF, secondaryDampingFactor, secondaryRiseTimeS, turnsRatio, voltsPerAmp } from './secondary.js';
import { ironBallastResistanceOhm, selfHeatedTemperatureK } from './thermal.js';
import { dwellTimeS, DwellMode, type DwellParams } from './timing.js';
import type { BallastSpec, BreakdownModel, EngineSpec, Provenance, ResolvedConditions, SetupSpec, SwitchingKind } from './types.js';
import { sparkRateHz } from './dwell.js';
import { crankingPath, crankingSupplyOf, supplyUnderPowerLoadV } from './cranking.js';

export interface PreparedCd {
  capacitorF: number;
  nominalV: number;
  chargerPowerW: number;
  supplyMinV: number;
  cutOutV: number;
  multiSparkBelowRpm: number | null;
  /** Secondary peak per volt of charge, running (hot primary winding in the transfer loop). */
  peakPerChargeV: number;
  /** The same while cranking (cold winding). */
  peakPerChargeCrankingV: number;
  /** Secondary rise time: the transfer loop's peak time pi / omega_d (cd.ts), running and cranking. */
  riseS: number;
  riseCrankingS: number;
  sparkDurationS: number;
}

export interface PreparedSetup extends DwellParams {
  spec: SetupSpec;
  kind: SwitchingKind;
  /** Why the setup is incomplete or inconsistent; empty when it is sound. */
  issues: string[];
  model: BreakdownModel;
  switchDropV: number;
  runningSupplyV: number;
  crankingSupplyV: number;
  /** A dynamo car below its cut-in speed: the battery at rest (the running supply otherwise). */
  restingSupplyV: number;
  coilColdOhm: number;
  coilHotOhm: number;
  ballastColdOhm: number;
  ballastHotOhm: number;
  ballastHotK: number;
  /** The ballast at the surroundings (cranking, a cold engine). */
  ballastColdK: number;
  harnessOhm: number;
  contactOhm: number;
  rRunningOhm: number;
  rCrankingOhm: number;
  rColdOhm: number;
  iFinalRunningA: number;
  iFinalCrankingA: number;
  /** Final current on the resting supply with the running (idle) resistances. */
  iFinalRestingA: number;
  tauRunningS: number;
  tauCrankingS: number;
  primaryInductanceH: number;
  condenserF: number;
  secondaryCapacitanceF: number;
  effectiveCapacitanceF: number;
  n: number;
  secondaryInductanceH: number;
  secondaryResistanceOhm: number;
  eta: number;
  clampV: number | null;
  /** The lower of n x clamp (Infinity without a clamp) and the coil's secondary ceiling. */
  capV: number;
  /** n x clamp, or Infinity without a clamp: the circuit's own limit, before the ceiling. */
  clampCapV: number;
  /** The coil's rated secondary (insulation) voltage: its own rating, else the engine's, else the default for the kind. */
  ceilingV: number;
  /** Where `ceilingV` came from ('catalogue' for the coil's own rating). */
  ceilingProvenance: Provenance;
  /** Inductive peak per primary ampere at break: sqrt(Lp / C_eff) x efficiency x secondary damping. */
  peakVPerA: number;
  /** e^(-alpha t*) of the secondary's series resistance (source-free series RLC, secondary.ts). */
  dampingFactor: number;
  couplingK: number;
  arcV: number;
  fouledShuntOhm: number;
  voltsPerAmp: number;
  /** Fouled-plug first peak per primary ampere at break. */
  fouledVPerA: number;
  riseS: number;
  /** Multiplies the breakdown voltage: 1, or 1/0.9 with the coil wired the wrong way round. */
  polarityFactor: number;
  moduleSupplyRunningV: number | null;
  moduleSupplyCrankingV: number | null;
  moduleSupplyRestingV: number | null;
  /** An iron-wire ballast heated by an inductive coil: solved at each running rpm by the sweep. */
  ironBallast: RunningBallast | null;
  cd: PreparedCd | null;
  magnetoRatedA: number;
  magnetoFullRpm: number;
}

const MODULE_KINDS: ReadonlySet<SwitchingKind> = new Set(['transistor-points', 'breakerless-fixed-duty', 'breakerless-current-limited', 'capacitive-discharge']);

/** A positive finite number, or the fallback with an issue noted. */
function pos(value: number | null | undefined, fallback: number, what: string, issues: string[]): number {
  if (typeof value === 'number' && Number.isFinite(value) && value > 0) return value;
  issues.push(`${what} is missing or not a positive number; ${fallback} was assumed.`);
  return fallback;
}
function nonNeg(value: number | null | undefined, fallback: number): number {
  return typeof value === 'number' && Number.isFinite(value) && value >= 0 ? value : fallback;
}

/** A ballast's resistance at a temperature: iron wire climbs steeply, ceramic and harness wire hold their value. */
function ballastAt(b: BallastSpec, coldOhm: number, tK: number): number {
  return b.ballastType === 'iron-wire' ? ironBallastResistanceOhm(coldOhm, tK) : coldOhm;
}

export function prepareSetup(engine: EngineSpec, setup: SetupSpec, c: ResolvedConditions, model: BreakdownModel): PreparedSetup {
  const issues: string[] = [];
  const kind = setup.switching;
  const mod = setup.module;
  const isModule = MODULE_KINDS.has(kind);
  if (isModule && !mod) issues.push(`A ${kind} setup needs a module; none is chosen.`);
  if (isModule && mod && mod.moduleType !== kind) issues.push(`The module chosen is a ${mod.moduleType} module, but the setup is described as ${kind}.`);
  if (!isModule && mod) issues.push('Points and magneto setups switch the coil themselves; the module chosen is ignored.');
  if (kind === 'magneto' && !setup.magneto) issues.push('A magneto needs its rated break current and the rpm of full output.');
  if (kind === 'capacitive-discharge' && mod && !mod.cd) issues.push('A capacitive-discharge module needs its capacitor, charge voltage and charger power.');
  const m = isModule ? mod : null;

  const coil = setup.coil;
  const r20 = pos(coil.primaryResistanceOhm20C.value, 3, 'The coil primary resistance', issues);
  const lp = pos(coil.primaryInductanceH, 0.008, 'The coil primary inductance', issues);
  const n = turnsRatio(coil.turnsRatio, coil.secondaryInductanceH, lp);
  const ls = coil.secondaryInductanceH !== null && coil.secondaryInductanceH > 0 ? coil.secondaryInductanceH : n * n * lp;
  const ambientC = c.ambientC.value;
  const hotC = c.underBonnetC.value;
  const coilCold = copperResistanceOhm(r20, ambientC);
  const coilHot = copperResistanceOhm(r20, hotC);
  const harness = nonNeg(c.harnessResistanceOhm.value, 0.1);
  const usesPoints = kind === 'points' || kind === 'magneto';
  const contact = usesPoints ? nonNeg(c.pointsContactResistanceOhm.value, 0.1) : 0;
  const switchDrop = m ? nonNeg(m.switchSaturationV, 0) : 0;
  const runV = nonNeg(c.runningSupplyV.value, 14);
  const crankV = crankingSupplyOf(c);
  // A dynamo gives nothing below its cut-in speed: there the coil sees the battery at rest.
  const dynamo = engine.charging === 'dynamo';
  const restV = dynamo ? nonNeg(c.restingBatteryV.value, engine.systemVoltageV === 6 ? 6.2 : 12.4) : runV;
  const idleV = dynamo && engine.idleRpm < c.dynamoCutInRpm.value ? restV : runV;

  // Dwell parameters.
  let mode: DwellMode = DwellMode.Cam;
  let fixedDuty = 0.5;
  let maxDuty = 0.9;
  let limitA = Infinity;
  if (kind === 'breakerless-fixed-duty') {
    mode = DwellMode.FixedDuty;
    fixedDuty = m?.fixedDutyFraction ?? (issues.push('A fixed-duty module needs its duty fraction; 0.5 was assumed.'), 0.5);
  } else if (kind === 'breakerless-current-limited') {
    mode = DwellMode.CurrentLimited;
    if (m && (m.currentLimitA === null || m.maxDutyFraction === null)) issues.push('A current-limited module needs its current limit and maximum duty.');
    limitA = m?.currentLimitA ?? m?.maxCurrentA ?? 6;
    maxDuty = m?.maxDutyFraction ?? 0.8;
  } else if (kind === 'capacitive-discharge') {
    mode = DwellMode.Cd;
  } else if (kind === 'magneto') {
    mode = DwellMode.Magneto;
  }
  // Any module with a current limit caps the current at break, whatever sets its dwell.
  if (m && m.currentLimitA !== null && m.currentLimitA > 0) limitA = Math.min(limitA, m.currentLimitA);
  const camFraction = dwellFractionFromAngle(engine.pointsDwellDeg, engine.cylinders);
  const dwellParams: DwellParams = {
    mode,
    camFraction,
    floatRpm: kind === 'points' || kind === 'transistor-points' ? engine.pointsFloatRpm : null,
    fixedDuty,
    maxDuty,
    holdS: nonNeg(c.currentLimitHoldS.value, 0.5e-3),
    limitA,
  };

  // Ballast: cold value, and the hot equilibrium at idle (the sweep solves each running rpm; see
  // ballast.ts). Idle is on the supply the coil sees at idle (a dynamo car may not charge there).
  const b = setup.ballast;
  const bCold = b ? pos(b.coldResistanceOhm.value, 1.5, 'The ballast resistance', issues) : 0;
  const theta = b ? (b.thermalResistanceKPerW ?? c.ballastThermalResistanceKPerW.value) : 0;
  const baseHot = coilHot + harness + contact;
  const ambientK = kelvin(hotC);
  let bHotK = kelvin(ambientC);
  let ironBallast: RunningBallast | null = null;
  if (b && kind !== 'magneto') {
    if (kind === 'capacitive-discharge') {
      // The ballast only carries the charger's input current, about P / V, the same at every rpm.
      const i = (m?.cd?.chargerPowerW ?? 0) / Math.max(1, runV);
      bHotK = selfHeatedTemperatureK(ambientK, Math.max(0, theta), (tK: number): number => i * i * ballastAt(b, bCold, tK));
    } else {
      const idleRate = sparkRateHz(engine.idleRpm, engine.cylinders, engine.cycle);
      const period = idleRate > 0 ? 1 / idleRate : 1;
      if (b.ballastType === 'iron-wire') {
        ironBallast = new RunningBallast(bCold, Math.max(0, theta), ambientK, baseHot, switchDrop, lp, dwellParams);
        ironBallast.supplyV = idleV;
        ironBallast.periodS = period;
        ironBallast.rpm = engine.idleRpm;
        // Secant steps from 100 K above the surroundings; bisection decides if they do not settle
        // on a stable equilibrium (ballast.ts).
        bHotK = ironBallast.settle(ambientK + 100, -1);
      } else {
        // Ceramic or harness wire holds its resistance, so its temperature follows directly.
        const r = baseHot + bCold;
        const iF = finalCurrentA(idleV, switchDrop, r);
        const tau = lp / r;
        bHotK = ambientK + Math.max(0, theta) * meanSquareCurrentA2(iF, tau, dwellTimeS(dwellParams, period, engine.idleRpm, iF, tau), period, limitA) * bCold;
      }
    }
  }
  const bHot = b ? ballastAt(b, bCold, bHotK) : 0;
  const rRunning = baseHot + bHot;
  const rCold = coilCold + harness + contact + bCold;
  const iRun = finalCurrentA(runV, switchDrop, rRunning);
  const iRest = finalCurrentA(restV, switchDrop, rRunning);
  const crank = crankingPath(setup, m, kind, crankV, coilCold, harness, contact, bCold, switchDrop, lp);

  // Secondary.
  const condenser = setup.condenserF !== null && setup.condenserF > 0 ? setup.condenserF : 0;
  const cs = pos(c.secondaryCapacitanceF.value, 70e-12, 'The secondary capacitance', issues);
  const cEff = effectiveSecondaryCapacitanceF(cs, condenser, n);
  const eta = Math.min(1, pos(c.transferEfficiency.value, 0.8, 'The transfer efficiency', issues));
  const clampV = m && m.primaryClampV !== null && m.primaryClampV > 0 ? m.primaryClampV : null;
  const clampCapV = clampV !== null ? n * clampV : Infinity;
  // The coil's insulation rating caps whatever the circuit could reach: its own rating, else the
  // engine's value, else the labelled default for this kind of system (conditions.ts).
  const ceiling = typeof coil.ratedSecondaryV === 'number' && coil.ratedSecondaryV > 0 ? null : secondaryCeilingFor(c, kind);
  const ceilingV = ceiling === null ? (coil.ratedSecondaryV as number) : pos(ceiling.value, secondaryCeilingDefaultV(kind), 'The secondary ceiling', issues);
  const ceilingProvenance: Provenance = ceiling === null ? 'catalogue' : ceiling.provenance;
  const capV = Math.min(clampCapV, ceilingV);
  const leadOhm = setup.leads ? nonNeg(setup.leads.resistancePerLeadOhm, 0) : 0;
  const plugOhm = setup.plug && setup.plug.resistor ? nonNeg(setup.plug.resistorOhm, 0) : 0;
  const rs = nonNeg(coil.secondaryResistanceOhm, 8000) + leadOhm + plugOhm;
  const damping = secondaryDampingFactor(rs, ls, cEff);
  // The coil's own coupling when its maker gives one, else the engine's condition (a labelled default).
  const kc = coil.couplingK ?? c.couplingK.value;
  const couplingK = Number.isFinite(kc) && kc > 0 && kc < 1 ? kc : DEFAULT_COUPLING_K.value;
  const fouledOhm = pos(c.fouledShuntOhm.value, 500_000, 'The fouled-plug shunt', issues);

  // Module supply: fed from terminal 15 it loses only the harness drop; fed after the ballast it
  // also loses the ballast drop whenever the coil draws current (the worst moment, just before break).
  // The cranking case is part of the cranking path above.
  let modRun: number | null = null;
  let modRest: number | null = null;
  let cd: PreparedCd | null = null;
  if (m) {
    const afterBallast = setup.moduleFeed === 'after-ballast' && b !== null;
    const feedRun = harness + (afterBallast ? bHot : 0);
    const isCdCharger = kind === 'capacitive-discharge' && m.cd !== null;
    modRun = isCdCharger ? supplyUnderPowerLoadV(runV, feedRun, m.cd!.chargerPowerW) : Math.max(0, runV - feedRun * iRun);
    modRest = isCdCharger ? supplyUnderPowerLoadV(restV, feedRun, m.cd!.chargerPowerW) : Math.max(0, restV - feedRun * iRest);
    if (kind === 'capacitive-discharge') {
      const stage = m.cd;
      const capF = stage ? pos(stage.capacitorF, 1e-6, 'The CD capacitor', issues) : 0;
      // The fast transfer rings through the leakage inductance and the loop resistance: the
      // primary winding plus the secondary series resistance reflected through n^2 (cd.ts).
      const leakageH = leakageInductanceH(lp, couplingK);
      const secondaryReflectedOhm = rs / (n * n);
      const hotLoop = { loopOhm: coilHot + secondaryReflectedOhm, leakageH };
      const coldLoop = { loopOhm: coilCold + secondaryReflectedOhm, leakageH };
      cd = {
        capacitorF: capF,
        nominalV: stage ? nonNeg(stage.chargeVoltageV, 0) : 0,
        chargerPowerW: stage ? nonNeg(stage.chargerPowerW, 0) : 0,
        supplyMinV: nonNeg(m.supplyMinV, 0),
        cutOutV: m.cutOutV ?? 0.75 * nonNeg(m.supplyMinV, 0),
        multiSparkBelowRpm: stage?.multiSparkBelowRpm ?? null,
        peakPerChargeV: capF > 0 ? cdSecondaryPeakV(capF, 1, n, cs, eta, hotLoop) : 0,
        peakPerChargeCrankingV: capF > 0 ? cdSecondaryPeakV(capF, 1, n, cs, eta, coldLoop) : 0,
        riseS: capF > 0 ? cdRiseTimeS(capF, n, cs, hotLoop) : 0,
        riseCrankingS: capF > 0 ? cdRiseTimeS(capF, n, cs, coldLoop) : 0,
        sparkDurationS: cdSparkDurationS(lp, capF),
      };
    }
  }

  return {
    mode: dwellParams.mode,
    camFraction: dwellParams.camFraction,
    floatRpm: dwellParams.floatRpm,
    fixedDuty: dwellParams.fixedDuty,
    maxDuty: dwellParams.maxDuty,
    holdS: dwellParams.holdS,
    limitA: dwellParams.limitA,
    spec: setup,
    kind,
    issues,
    model,
    switchDropV: switchDrop,
    runningSupplyV: kind === 'magneto' ? 0 : runV,
    crankingSupplyV: kind === 'magneto' ? 0 : crankV,
    restingSupplyV: kind === 'magneto' ? 0 : restV,
    coilColdOhm: coilCold,
    coilHotOhm: coilHot,
    ballastColdOhm: bCold,
    ballastHotOhm: bHot,
    ballastHotK: bHotK,
    ballastColdK: kelvin(ambientC),
    harnessOhm: harness,
    contactOhm: contact,
    rRunningOhm: rRunning,
    rCrankingOhm: crank.rCrankingOhm,
    rColdOhm: rCold,
    iFinalRunningA: kind === 'magneto' ? 0 : iRun,
    iFinalCrankingA: crank.iFinalCrankingA,
    iFinalRestingA: kind === 'magneto' ? 0 : iRest,
    tauRunningS: lp / Math.max(1e-6, rRunning),
    tauCrankingS: crank.tauCrankingS,
    primaryInductanceH: lp,
    condenserF: condenser,
    secondaryCapacitanceF: cs,
    effectiveCapacitanceF: cEff,
    n,
    secondaryInductanceH: ls,
    secondaryResistanceOhm: rs,
    eta,
    clampV,
    capV,
    clampCapV,
    ceilingV,
    ceilingProvenance,
    peakVPerA: voltsPerAmp(lp, cEff) * eta * damping,
    dampingFactor: damping,
    couplingK,
    arcV: pos(c.arcVoltageV.value, 700, 'The arc voltage', issues),
    fouledShuntOhm: fouledOhm,
    voltsPerAmp: voltsPerAmp(lp, cEff),
    // The inductor starts with the flux current at break over n (the sweep works that current
    // out with the shunt loading the dwell too, fouled.ts); the efficiency scales the delivered peak.
    fouledVPerA: (eta / n) * parallelRlcPeakVPerA(ls, cEff, fouledOhm),
    riseS: secondaryRiseTimeS(ls, cEff),
    polarityFactor: setup.coilWiring === 'reversed' ? REVERSED_POLARITY_FACTOR : 1,
    moduleSupplyRunningV: modRun,
    moduleSupplyCrankingV: crank.moduleSupplyCrankingV,
    moduleSupplyRestingV: modRest,
    ironBallast,
    cd,
    magnetoRatedA: setup.magneto ? nonNeg(setup.magneto.ratedCurrentA, 0) : 0,
    magnetoFullRpm: setup.magneto ? nonNeg(setup.magneto.fullOutputRpm, 1) : 1,
  };
}
