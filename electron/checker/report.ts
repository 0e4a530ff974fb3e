/**
 * Turn an analysis (columns of numbers) into the plain report the UI, the CLI and the SPICE deck
 * writer read. Every number is forced finite here as a last guard.
 */
import { whatToDo } from './advice.js';
import { noSparkWords, type NoSparkWords } from './no-spark.js';
import { conditionUnits, secondaryCeilingFor } from './conditions.js';
import type { Analysis, Session } from './session.js';
import type { RpmGrid } from './grid.js';
import type { Workspace } from './sweep.js';
import type { PreparedSetup } from './prepare.js';
import { setupFigures, sparkEnergyAt } from './report-figures.js';
import type { CircuitAtRpm, ConditionName, Figure, OperatingPoint, ResolvedCircuit, SetupReport } from './types.js';

const fin = (x: number): number => (Number.isFinite(x) ? x : 0);

function point(grid: RpmGrid, ws: Workspace, i: number, isCd: boolean, dead: NoSparkWords, p: PreparedSetup): OperatingPoint {
  const avail = fin(ws.availableV[i]!);
  const req = fin(ws.requiredV[i]!);
  return {
    rpm: fin(grid.rpm[i]!),
    supplyCase: grid.cranking[i] === 1 ? 'cranking' : 'running',
    supplyV: fin(ws.supplyV[i]!),
    primaryResistanceOhm: fin(ws.resistanceOhm[i]!),
    sparkRateHz: fin(grid.sparkRateHz[i]!),
    periodS: fin(grid.periodS[i]!),
    dwellTimeS: fin(ws.dwellS[i]!),
    offTimeS: fin(ws.offS[i]!),
    currentAtBreakA: fin(ws.currentA[i]!),
    storedEnergyJ: fin(ws.energyJ[i]!),
    availableV: avail,
    requiredV: req,
    reserveV: avail - req,
    reserveRatio: fin(ws.reserveRatio[i]!),
    riseTimeS: fin(ws.riseS[i]!),
    sparkDurationS: fin(ws.durationS[i]!),
    sparkAngleDegBtdc: fin(grid.sparkAngleDegBtdc[i]!),
    cylinderPressurePa: fin(grid.pressurePa[i]!),
    cylinderTemperatureK: fin(grid.temperatureK[i]!),
    fouledPeakV: fin(ws.fouledV[i]!),
    cdChargeVoltageV: isCd ? fin(ws.cdChargeV[i]!) : null,
    multiSpark: ws.multiSpark[i] === 1,
    noSparkReason: ws.noSpark[i] === 1 ? ((grid.cranking[i] === 1 ? dead.cranking : grid.resting[i] === 1 ? dead.resting : dead.running) ?? 'No spark: the module does not switch.') : null,
    moduleDissipationW: fin(ws.moduleW[i]!),
    availableBeforeCeilingV: fin(ws.uncappedV[i]!),
    cappedAtCeiling: ws.uncappedV[i]! > p.ceilingV,
    sparkEnergyJ: fin(sparkEnergyAt(p, ws, i)),
    ballastTemperatureK: p.spec.ballast ? fin(ws.ballastK[i]!) : null,
  };
}

function circuitOf(a: Analysis): ResolvedCircuit {
  const p = a.prep;
  return {
    runningSupplyV: fin(p.runningSupplyV),
    crankingSupplyV: fin(p.crankingSupplyV),
    switchDropV: fin(p.switchDropV),
    primaryResistanceHotOhm: fin(p.rRunningOhm),
    primaryResistanceColdOhm: fin(p.rColdOhm),
    primaryResistanceCrankingOhm: fin(p.rCrankingOhm),
    coilResistanceColdOhm: fin(p.coilColdOhm),
    coilResistanceHotOhm: fin(p.coilHotOhm),
    ballastResistanceColdOhm: fin(p.ballastColdOhm),
    ballastResistanceHotOhm: fin(p.ballastHotOhm),
    ballastTemperatureHotK: fin(p.ballastHotK),
    harnessResistanceOhm: fin(p.harnessOhm),
    contactResistanceOhm: fin(p.contactOhm),
    primaryInductanceH: fin(p.primaryInductanceH),
    condenserF: fin(p.condenserF),
    secondaryCapacitanceF: fin(p.secondaryCapacitanceF),
    turnsRatio: fin(p.n),
    secondaryInductanceH: fin(p.secondaryInductanceH),
    secondaryResistanceOhm: fin(p.secondaryResistanceOhm),
    transferEfficiency: fin(p.eta),
    primaryClampV: p.clampV,
    arcVoltageV: fin(p.arcV),
    fouledShuntOhm: fin(p.fouledShuntOhm),
    finalCurrentRunningA: fin(p.iFinalRunningA),
    finalCurrentCrankingA: fin(p.iFinalCrankingA),
    moduleSupplyCrankingV: p.moduleSupplyCrankingV,
    moduleSupplyRunningV: p.moduleSupplyRunningV,
    cd: p.cd ? { capacitorF: p.cd.capacitorF, nominalChargeVoltageV: p.cd.nominalV, chargerPowerW: p.cd.chargerPowerW } : null,
    restingSupplyV: fin(p.restingSupplyV),
    secondaryCeilingV: fin(p.ceilingV),
    secondaryDampingFactor: fin(p.dampingFactor),
    couplingK: fin(p.couplingK),
  };
}

function inputsOf(s: Session, a: Analysis): Figure[] {
  const out: Figure[] = [];
  for (const key of Object.keys(s.conditions) as ConditionName[]) {
    // The ceiling's default depends on the kind of system: the one this setup takes (conditions.ts).
    const v = key === 'secondaryCeilingV' ? secondaryCeilingFor(s.conditions, a.prep.kind) : s.conditions[key];
    out.push({ name: key, value: v.value, unit: conditionUnits[key], provenance: v.provenance });
  }
  const coil = a.setup.coil;
  out.push({ name: 'coil primary resistance at 20 degC', value: coil.primaryResistanceOhm20C.value, unit: 'ohm', provenance: coil.primaryResistanceOhm20C.provenance });
  // Only the capacitive-discharge peak uses the coupling (its transfer rings through the leakage).
  if (a.prep.cd) out.push({ name: 'coil coupling coefficient', value: a.prep.couplingK, unit: '', provenance: a.setup.coil.couplingK != null ? 'catalogue' : s.conditions.couplingK.provenance });
  // The coil's own rating, else the engine's value, else the default for this kind of system.
  out.push({ name: 'coil secondary ceiling', value: a.prep.ceilingV, unit: 'V', provenance: a.prep.ceilingProvenance });
  const b = a.setup.ballast;
  if (b) {
    out.push({ name: 'ballast resistance at 20 degC', value: b.coldResistanceOhm.value, unit: 'ohm', provenance: b.coldResistanceOhm.provenance });
    out.push(
      b.thermalResistanceKPerW !== null
        ? { name: 'ballast thermal resistance', value: b.thermalResistanceKPerW, unit: 'K/W', provenance: 'catalogue' }
        : { name: 'ballast thermal resistance', value: s.conditions.ballastThermalResistanceKPerW.value, unit: 'K/W', provenance: s.conditions.ballastThermalResistanceKPerW.provenance },
    );
  }
  const leads = a.setup.leads;
  if (leads?.resistanceProvenance) out.push({ name: 'HT lead resistance', value: leads.resistancePerLeadOhm, unit: 'ohm', provenance: leads.resistanceProvenance });
  return out;
}

export function toReport(s: Session, a: Analysis): SetupReport {
  const grid = s.grids.sweep;
  const points: OperatingPoint[] = new Array(grid.n);
  const isCd = a.prep.cd !== null;
  const dead = noSparkWords(a.prep);
  for (let i = 0; i < grid.n; i++) points[i] = point(grid, a.ws, i, isCd, dead, a.prep);
  const kg = s.grids.key;
  return {
    label: a.setup.label,
    switching: a.setup.switching,
    circuit: circuitOf(a),
    points,
    keyPoints: { cranking: point(kg, a.keyWs, 0, isCd, dead, a.prep), idle: point(kg, a.keyWs, 1, isCd, dead, a.prep), mid: point(kg, a.keyWs, 2, isCd, dead, a.prep), redline: point(kg, a.keyWs, 3, isCd, dead, a.prep) },
    keyOn: {
      currentFlows: a.keyOn.currentFlows,
      currentA: fin(a.keyOn.currentA),
      coilDissipationW: fin(a.keyOn.coilDissipationW),
      ballastDissipationW: fin(a.keyOn.ballastDissipationW),
      moduleDissipationW: fin(a.keyOn.moduleDissipationW),
    },
    rules: a.rules,
    verdict: a.verdict,
    actions: whatToDo(a.rules),
    worstReserveRatio: fin(a.worstRatio),
    worstReserveRpm: fin(grid.rpm[a.worstIndex]!),
    belowMarginFromRpm: a.belowMarginIndex >= 0 ? fin(grid.rpm[a.belowMarginIndex]!) : null,
    gap: a.gap,
    breakdownModel: s.model,
    figures: setupFigures(s.engine, s.grids, a.prep, a.ws, a.keyWs),
    inputs: inputsOf(s, a),
  };
}

/**
 * The circuit at one rpm, for a SPICE deck: the resolved circuit plus the per-rpm values,
 * interpolated linearly between the two sweep points around `rpm` (the cranking point is used at
 * or below cranking speed).
 */
export function circuitAtRpm(report: SetupReport, rpm: number): CircuitAtRpm {
  const pts = report.points;
  const first = pts[0]!;
  let a = first;
  let b = first;
  let t = 0;
  if (pts.length > 1 && rpm > first.rpm) {
    let i = 1;
    while (i < pts.length - 1 && pts[i]!.rpm < rpm) i++;
    a = i > 1 ? pts[i - 1]! : pts[1]!;
    b = pts[i]!;
    t = b.rpm > a.rpm ? Math.min(1, Math.max(0, (rpm - a.rpm) / (b.rpm - a.rpm))) : 0;
  }
  const lerp = (x: number, y: number): number => x + (y - x) * t;
  const c = report.circuit;
  const cdV = a.cdChargeVoltageV !== null || b.cdChargeVoltageV !== null ? lerp(a.cdChargeVoltageV ?? 0, b.cdChargeVoltageV ?? 0) : null;
  return {
    rpm: fin(rpm),
    supplyV: lerp(a.supplyV, b.supplyV),
    switchDropV: c.switchDropV,
    primaryResistanceOhm: lerp(a.primaryResistanceOhm, b.primaryResistanceOhm),
    primaryInductanceH: c.primaryInductanceH,
    dwellTimeS: lerp(a.dwellTimeS, b.dwellTimeS),
    currentAtBreakA: lerp(a.currentAtBreakA, b.currentAtBreakA),
    storedEnergyJ: lerp(a.storedEnergyJ, b.storedEnergyJ),
    condenserF: c.condenserF,
    secondaryCapacitanceF: c.secondaryCapacitanceF,
    turnsRatio: c.turnsRatio,
    secondaryInductanceH: c.secondaryInductanceH,
    secondaryResistanceOhm: c.secondaryResistanceOhm,
    transferEfficiency: c.transferEfficiency,
    primaryClampV: c.primaryClampV,
    availablePeakV: lerp(a.availableV, b.availableV),
    fouledShuntOhm: c.fouledShuntOhm,
    fouledPeakV: lerp(a.fouledPeakV, b.fouledPeakV),
    cd: c.cd && cdV !== null ? { capacitorF: c.cd.capacitorF, chargeVoltageV: cdV, peakV: lerp(a.availableV, b.availableV) } : null,
  };
}
