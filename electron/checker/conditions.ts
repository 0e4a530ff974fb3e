/**
 * Operating conditions: the defaults the checker assumes, each labelled with where it came from,
 * and the merge with whatever the caller overrides (an engine's own values, a measured reading).
 */
import type { ConditionInputs, ConditionName, EngineSpec, Provenance, ResolvedConditions, Sourced, SwitchingKind } from './types.js';

const WORKSHOP: Provenance = 'default (workshop documentation)';
const MEMORY: Provenance = 'default (from memory)';
const PRACTICE: Provenance = 'default (common practice)';
const STANDARD: Provenance = 'default (standard value)';

const d = (value: number, provenance: Provenance): Sourced => ({ value, provenance });

/** Unit of each condition, for reports. */
export const conditionUnits: Record<ConditionName, string> = {
  runningSupplyV: 'V',
  crankingSupplyV: 'V',
  harnessResistanceOhm: 'ohm',
  ambientC: 'degC',
  underBonnetC: 'degC',
  volumetricEfficiency: '',
  ambientPressurePa: 'Pa',
  inletChargeC: 'degC',
  pointsContactResistanceOhm: 'ohm',
  secondaryCapacitanceF: 'F',
  transferEfficiency: '',
  arcVoltageV: 'V',
  fouledShuntOhm: 'ohm',
  ballastThermalResistanceKPerW: 'K/W',
  coilDissipationLimitW: 'W',
  currentLimitHoldS: 's',
  marginRatio: '',
  polytropicIndex: '',
  couplingK: '',
  dynamoCutInRpm: 'rpm',
  restingBatteryV: 'V',
  secondaryCeilingV: 'V',
};

/**
 * Battery load-test pass floor against temperature, as printed in workshop manuals: a healthy 12 V
 * battery holds at least 9.6 / 9.4 / 9.1 / 8.7 / 8.5 V under load at 21 / 10 / -1 / -12 / -18 degC.
 * We use it as the cranking supply a healthy battery gives at the ambient temperature.
 */
export const CRANKING_FLOOR_TABLE: ReadonlyArray<readonly [number, number]> = [
  [-18, 8.5],
  [-12, 8.7],
  [-1, 9.1],
  [10, 9.4],
  [21, 9.6],
];

/** Cranking floor at an ambient temperature, interpolated; held flat beyond the table. */
export function crankingFloorV(ambientC: number): number {
  const t = CRANKING_FLOOR_TABLE;
  if (!(ambientC > t[0]![0])) return t[0]![1];
  for (let i = 1; i < t.length; i++) {
    const [c1, v1] = t[i]!;
    if (ambientC <= c1) {
      const [c0, v0] = t[i - 1]!;
      return v0 + ((v1 - v0) * (ambientC - c0)) / (c1 - c0);
    }
  }
  return t[t.length - 1]![1];
}

/**
 * The defaults. Running 14.0 V is the middle of a 13.5 to 14.5 V regulated range and cranking
 * 9.6 V is the load-test pass floor at 21 degC, both as printed in workshop manuals; the 6 V
 * figures (7.2 V charging, 4.8 V cranking) are from memory. Everything else is from memory or
 * common practice and says so.
 */
export function defaultConditions(engine: EngineSpec, ambientC = 20): ResolvedConditions {
  const six = engine.systemVoltageV === 6;
  const crank12 = crankingFloorV(ambientC);
  return {
    runningSupplyV: six ? d(7.2, MEMORY) : d(14.0, WORKSHOP),
    // 6 V: half the 12 V floor (from memory: 4.8 V at 21 degC).
    crankingSupplyV: six ? d(crank12 / 2, MEMORY) : d(crank12, WORKSHOP),
    harnessResistanceOhm: d(0.1, MEMORY),
    ambientC: d(ambientC, PRACTICE),
    underBonnetC: d(80, PRACTICE),
    // Full load is the worst case for the required voltage.
    volumetricEfficiency: d(0.85, MEMORY),
    ambientPressurePa: d(101_325, STANDARD),
    // The charge picks up heat from the manifold and valves before inlet closing (about 330 K).
    inletChargeC: d(57, MEMORY),
    pointsContactResistanceOhm: d(0.1, MEMORY),
    // Coil tower, lead and plug together: 50 to 100 pF.
    secondaryCapacitanceF: d(70e-12, MEMORY),
    // Fraction of the modelled secondary peak a real coil delivers: the losses neither closed form
    // draws, chiefly eddy current and hysteresis in the core. The inductive closed form is lossless
    // (ngspice with leakage and winding resistance lands within a few per cent of it); the CD form
    // already carries its leakage and winding loss (cd.ts), so the efficiency is applied once to each.
    transferEfficiency: d(0.8, MEMORY),
    // Glow-phase arc voltage of an inductive spark: 0.5 to 1 kV.
    arcVoltageV: d(700, MEMORY),
    // A carbon-fouled insulator nose: hundreds of kilohm.
    fouledShuntOhm: d(500_000, MEMORY),
    // A finned open-coil iron ballast in free air.
    ballastThermalResistanceKPerW: d(8, MEMORY),
    // What a sealed oil-filled coil sheds continuously without damage.
    coilDissipationLimitW: d(80, MEMORY),
    // A current-limited module holds the limit a little before it breaks, so the current is surely there.
    currentLimitHoldS: d(0.5e-3, MEMORY),
    marginRatio: d(1.25, PRACTICE),
    // Compression from inlet closing to the spark, p V^n constant: about 1.3 (Heywood 1988, from memory).
    polytropicIndex: d(1.3, MEMORY),
    // Magnetic coupling of primary and secondary: oil-filled canister coils are quoted at 0.98 to
    // 0.999 (from memory). The CD transfer rings through the leakage 2 (1 - k) Lp (cd.ts).
    couplingK: d(DEFAULT_COUPLING_K.value, MEMORY),
    // Engine speed at which a dynamo starts to charge: about 1,000 to 1,200 rpm (from memory).
    // Only a dynamo car (engine.charging 'dynamo') uses it.
    dynamoCutInRpm: d(1100, MEMORY),
    // A healthy battery at rest, neither charging nor loaded: 12.4 V (6.2 V on 6 V), common practice.
    restingBatteryV: six ? d(6.2, PRACTICE) : d(12.4, PRACTICE),
    // The secondary a coil is built to give (its insulation rating) when the coil record gives
    // none: 30 kV, the default for points and inductive systems. While it keeps a default label a
    // setup takes the default for its own kind instead (`secondaryCeilingDefaultV`: 40 kV with a
    // capacitive-discharge unit); an engine's own value holds for every setup.
    secondaryCeilingV: d(secondaryCeilingDefaultV('points'), MEMORY),
  };
}

/**
 * The coil's rated secondary (insulation) voltage taken when neither the coil nor the engine gives
 * one, by the kind of system: canister coils are built for 30 to 40 kV (from memory); 30 kV behind
 * points, a transistor or breakerless inductive module and on a magneto, 40 kV for a coil run from a
 * capacitive-discharge unit, whose fast rise asks more of the insulation (from memory).
 */
export function secondaryCeilingDefaultV(kind: SwitchingKind): number {
  return kind === 'capacitive-discharge' ? 40_000 : 30_000;
}

/**
 * The secondary ceiling a setup of `kind` uses when its coil gives no rating: the engine's own
 * value when one was given (any label but a default's), else the default for the kind.
 */
export function secondaryCeilingFor(c: ResolvedConditions, kind: SwitchingKind): Sourced {
  const given = c.secondaryCeilingV;
  if (!given.provenance.startsWith('default')) return given;
  return d(secondaryCeilingDefaultV(kind), MEMORY);
}

/**
 * Magnetic coupling of primary and secondary in a closed-iron canister coil: oil-filled canister
 * coils are quoted at 0.98 to 0.999 (from memory). Only the capacitive-discharge peak uses it (its
 * fast transfer rings through the leakage inductance 2 (1 - k) Lp); the inductive forms take the
 * coil as ideal. It is the default of the working condition `couplingK`. The SPICE exporter draws
 * its coupling element with the coupling the report's circuit carries (the coil's own, else the
 * engine's condition), falling back to this value (electron/spice/decks.ts, `couplingOf`).
 */
export const DEFAULT_COUPLING_K: Readonly<Sourced> = Object.freeze(d(0.995, MEMORY));

/** Defaults overlaid with the caller's values; a non-finite override is ignored (the default stands). */
export function resolveConditions(engine: EngineSpec, inputs?: ConditionInputs): ResolvedConditions {
  // The cranking default follows the ambient temperature (a cold morning pulls a battery lower).
  const amb = inputs?.ambientC;
  const out = defaultConditions(engine, amb && Number.isFinite(amb.value) ? amb.value : 20);
  if (!inputs) return out;
  for (const key of Object.keys(out) as ConditionName[]) {
    const given = inputs[key];
    if (given && Number.isFinite(given.value)) out[key] = { value: given.value, provenance: given.provenance };
  }
  return out;
}

/** Convert Celsius to kelvin. */
export const kelvin = (c: number): number => c + 273.15;
