/**
 * Why a sweep point has no spark, in words for the report: the module's own supply is below what
 * it needs to switch (an inductive module's minimum supply, a CD charger's cut-out). The sweep
 * marks such points (`Workspace.noSpark`) and gives them zero current, energy and voltage.
 */
import type { PreparedSetup } from './prepare.js';

export interface NoSparkWords {
  cranking: string | null;
  running: string | null;
  /** A dynamo car below the dynamo's cut-in: the battery at rest. */
  resting: string | null;
}

const v2 = (x: number): string => (Number.isFinite(x) ? x.toFixed(2) : '-');

function why(p: PreparedSetup, supplyV: number | null, when: string): string | null {
  const m = p.spec.module;
  if (m === null || supplyV === null) return null;
  if (p.kind === 'capacitive-discharge') {
    const cut = p.cd?.cutOutV ?? 0;
    return `No spark ${when}: the module sees ${v2(supplyV)} V, at or below the ${v2(cut)} V where its charger cuts out.`;
  }
  return `No spark ${when}: the module sees ${v2(supplyV)} V, below the ${v2(m.supplyMinV)} V it needs to switch the coil.`;
}

/** The sentence for each supply case (used only where the sweep marked a point). */
export function noSparkWords(p: PreparedSetup): NoSparkWords {
  return { cranking: why(p, p.moduleSupplyCrankingV, 'while cranking'), running: why(p, p.moduleSupplyRunningV, 'while running'), resting: why(p, p.moduleSupplyRestingV, 'below the dynamo\'s cut-in') };
}

/**
 * Whether an inductive module's own supply is below the minimum it needs to switch: its cut-out
 * (the limit the cranking-supply rule fails on). Points and magnetos have none; a CD unit's
 * charger has its own cut-out (cdChargeVoltageV gives 0 at or below it).
 */
export function moduleCutOut(p: PreparedSetup, moduleSupplyV: number | null): boolean {
  const m = p.spec.module;
  if (m === null || moduleSupplyV === null || p.kind === 'points' || p.kind === 'magneto' || p.kind === 'capacitive-discharge') return false;
  return moduleSupplyV < m.supplyMinV;
}

/** The sweep columns a point without a spark sets (the sweep's Workspace has them all). */
type Column = Float64Array | Uint8Array;
export interface NoSparkColumns {
  dwellS: Column; offS: Column; currentA: Column; energyJ: Column; riseS: Column; durationS: Column; fouledV: Column;
  cdChargeV: Column; multiSpark: Column; noSpark: Column; moduleW: Column; availableV: Column; uncappedV: Column; reserveRatio: Column;
}

/** A point where the module does not switch: no dwell, no current, no energy, no voltage, reserve 0. */
export function noSparkPoint(ws: NoSparkColumns, i: number, periodS: number, fouledToo: boolean): void {
  ws.dwellS[i] = 0;
  ws.offS[i] = periodS;
  ws.currentA[i] = 0;
  ws.energyJ[i] = 0;
  ws.riseS[i] = 0;
  ws.durationS[i] = 0;
  ws.fouledV[i] = fouledToo ? 0 : NaN;
  ws.cdChargeV[i] = 0;
  ws.multiSpark[i] = 0;
  ws.noSpark[i] = 1;
  ws.moduleW[i] = 0;
  ws.availableV[i] = 0;
  ws.uncappedV[i] = 0;
  ws.reserveRatio[i] = 0;
}
