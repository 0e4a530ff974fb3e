/**
 * Key on, engine stopped (keyon.ts through `checkSetup`): which systems leave the coil switched on,
 * the current by Ohm's law through coil, harness, points and ballast, an iron ballast at its
 * self-heated equilibrium, a ceramic ballast at its cold value, and a current-limited module that
 * holds its limit and burns the rest. Written against the mutation-testing survivors (npm run mutate).
 *
 * Every expected value is worked out here: Ohm's law I = (V - V_switch) / R, Joule's law P = I^2 R,
 * the switch's own loss P = V_switch x I, and for the iron ballast the equilibrium
 * T = T_surroundings + theta x P(T) (temperature rise = thermal resistance x power) solved by our own
 * bisection over pure iron's resistivity (handbook table values, from memory).
 * The defaults used (conditions.ts labels them): running supply 14.0 V (workshop manuals), harness
 * 0.1 ohm and points contact 0.1 ohm (from memory), surroundings 20 degC (so a copper coil reads its
 * 20 degC value), under the bonnet 80 degC (common practice), ballast 8 K/W (from memory).
 */
import { describe, expect, it } from 'vitest';
import { checkSetup } from '../../electron/checker/index.js';
import type { BallastSpec, ModuleSpec, SetupSpec } from '../../electron/checker/index.js';
import { ballastCoil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

const V = 14.0; // running supply, workshop manuals
const HARNESS = 0.1; // from memory
const CONTACT = 0.1; // points contact, from memory
const THETA = 8; // K/W, ballast to air, from memory
const UNDER_BONNET_K = 80 + 273.15; // common practice
const SAT = 1.5; // the fixture module's switch saturation voltage

const keyOn = (setup: SetupSpec) => checkSetup(fourCylinder, setup, undefined, { rpmPoints: 12, skipGapSuggestion: true }).keyOn;

/** Pure iron resistivity, micro-ohm cm, against kelvin (handbook table values, from memory). */
const IRON: Array<[number, number]> = [
  [293, 9.61],
  [300, 9.98],
  [400, 16.1],
  [500, 23.7],
  [600, 32.9],
  [700, 44.0],
  [800, 57.1],
];
function ironRho(tK: number): number {
  for (let i = 1; i < IRON.length; i++) {
    const [t0, r0] = IRON[i - 1]!;
    const [t1, r1] = IRON[i]!;
    if (tK <= t1 || i === IRON.length - 1) return r0 + ((r1 - r0) * (tK - t0)) / (t1 - t0);
  }
  throw new Error('unreachable');
}
/** An iron-wire resistor of `cold20` ohm at 20 degC, at tK: R scales with the resistivity. */
const ironOhm = (cold20: number, tK: number): number => (cold20 * ironRho(tK)) / ironRho(293.15);

/** Our own solution of T = T_amb + theta I(T)^2 R(T), I(T) = drive / (rest + R(T)), by bisection. */
function ironEquilibrium(cold20: number, rest: number, drive: number): { rb: number; i: number; tK: number } {
  const g = (t: number): number => {
    const r = ironOhm(cold20, t);
    const i = drive / (rest + r);
    return UNDER_BONNET_K + THETA * i * i * r - t;
  };
  let lo = UNDER_BONNET_K;
  let hi = 800;
  expect(g(lo)).toBeGreaterThan(0);
  expect(g(hi)).toBeLessThan(0);
  for (let k = 0; k < 60; k++) {
    const mid = (lo + hi) / 2;
    if (g(mid) > 0) lo = mid;
    else hi = mid;
  }
  const tK = (lo + hi) / 2;
  const rb = ironOhm(cold20, tK);
  return { rb, i: drive / (rest + rb), tK };
}

const flowing = (m: ModuleSpec) => keyOn(moduleSetup(m, { coil: ballastCoil() }));
const ceramic = (ohm = 1.5): BallastSpec => ({ name: 'Ceramic 1.5 ohm', ballastType: 'ceramic', coldResistanceOhm: { value: ohm, provenance: 'catalogue' }, thermalResistanceKPerW: null });

describe('which systems leave the coil switched on with the engine stopped', () => {
  it('transistor-assisted points follow the points, which can rest closed: current flows even with a stall shut-off on the unit', () => {
    // Trade fact (common practice): the transistor conducts whenever the points are closed.
    const r = flowing(module({ moduleType: 'transistor-points', currentLimitA: null, maxDutyFraction: null, stallShutOff: true }));
    expect(r.currentFlows).toBe(true);
    // Ohm's law: (14 - 1.5) V over the 1.5 ohm coil + 0.1 ohm harness (no points contact in the coil circuit).
    expect(r.currentA).toBeCloseTo((V - SAT) / (1.5 + HARNESS), 9);
  });
  it('a breakerless module holds the coil on unless it has a stall shut-off', () => {
    const limited = (stallShutOff: boolean) => flowing(module({ stallShutOff, currentLimitA: 9, maxCurrentA: 10 }));
    const fixed = (stallShutOff: boolean) => flowing(module({ moduleType: 'breakerless-fixed-duty', currentLimitA: null, maxDutyFraction: null, fixedDutyFraction: 0.6, stallShutOff }));
    expect(limited(false).currentFlows).toBe(true);
    expect(limited(true).currentFlows).toBe(false);
    expect(fixed(false).currentFlows).toBe(true);
    expect(fixed(true).currentFlows).toBe(false);
    // (14 - 1.5) / 1.6 = 7.8 A, under the 9 A limit: Ohm's law stands.
    expect(limited(false).currentA).toBeCloseTo((V - SAT) / (1.5 + HARNESS), 9);
    expect(fixed(false).currentA).toBeCloseTo((V - SAT) / (1.5 + HARNESS), 9);
    expect(limited(true)).toEqual({ currentFlows: false, currentA: 0, coilDissipationW: 0, moduleDissipationW: 0, ballastDissipationW: 0 });
  });
  it('a breakerless setup with no module chosen is taken at its worst: the coil stays on', () => {
    for (const switching of ['breakerless-current-limited', 'breakerless-fixed-duty'] as const) {
      const r = keyOn(pointsSetup({ switching, module: null, condenserF: null }));
      expect(r.currentFlows).toBe(true);
      // No module: no switch drop and no points contact; 14 V over the 3 ohm coil and 0.1 ohm harness.
      expect(r.currentA).toBeCloseTo(V / (3 + HARNESS), 9);
    }
  });
  it('the module switch burns its saturation voltage times the current (P = V I)', () => {
    const r = flowing(module({ stallShutOff: false, currentLimitA: 9, maxCurrentA: 10 }));
    const i = (V - SAT) / (1.5 + HARNESS);
    expect(r.moduleDissipationW).toBeCloseTo(SAT * i, 9);
    expect(r.coilDissipationW).toBeCloseTo(i * i * 1.5, 9);
    expect(r.ballastDissipationW).toBe(0);
  });
});

describe('a current-limited module at key-on holds its limit and burns the difference', () => {
  it('caps 7.8 A at a 6 A limit; the module drops what the coil and harness do not', () => {
    const r = flowing(module({ stallShutOff: false, currentLimitA: 6, maxCurrentA: 8 }));
    expect((V - SAT) / (1.5 + HARNESS)).toBeGreaterThan(6);
    expect(r.currentA).toBe(6);
    // Kirchhoff's voltage law: the module drops 14 - 6 x 1.6 = 4.4 V at 6 A: 26.4 W.
    expect(r.moduleDissipationW).toBeCloseTo(6 * (V - 6 * (1.5 + HARNESS)), 9);
    expect(r.moduleDissipationW).toBeCloseTo(26.4, 9);
    expect(r.coilDissipationW).toBeCloseTo(6 * 6 * 1.5, 9);
  });
});

describe('ballasts at key-on', () => {
  it('a ceramic ballast keeps its cold value (common practice): Ohm\'s law on 1.5 + 1.5 + 0.1 + 0.1 ohm', () => {
    const r = keyOn(pointsSetup({ coil: ballastCoil(), ballast: ceramic() }));
    const i = V / (1.5 + 1.5 + HARNESS + CONTACT);
    expect(r.currentA).toBeCloseTo(i, 9);
    expect(r.currentA).toBeCloseTo(4.375, 9);
    expect(r.ballastDissipationW).toBeCloseTo(i * i * 1.5, 9);
    expect(r.coilDissipationW).toBeCloseTo(i * i * 1.5, 9);
  });
  it('an iron-wire ballast heats itself to equilibrium under the bonnet (points)', () => {
    const r = keyOn(pointsSetup({ coil: ballastCoil(), ballast: ironBallast() }));
    const rest = 1.5 + HARNESS + CONTACT;
    const eq = ironEquilibrium(1.5, rest, V);
    // It settles somewhere between 500 and 600 K, so well above its cold 1.5 ohm.
    expect(eq.tK).toBeGreaterThan(500);
    expect(eq.tK).toBeLessThan(600);
    expect(eq.rb).toBeGreaterThan(3);
    expect(r.currentA).toBeCloseTo(eq.i, 4);
    expect(r.ballastDissipationW).toBeCloseTo(eq.i * eq.i * eq.rb, 3);
    expect(r.coilDissipationW).toBeCloseTo(eq.i * eq.i * 1.5, 3);
    expect(r.moduleDissipationW).toBe(0);
    // The figures hang together: Ohm's law over the whole loop, and the equilibrium itself.
    const rb = V / r.currentA - rest;
    expect(r.ballastDissipationW).toBeCloseTo(r.currentA ** 2 * rb, 6);
  });
  it('an iron-wire ballast in front of a module: the module\'s drop as well', () => {
    const r = keyOn(moduleSetup(module({ stallShutOff: false, currentLimitA: 9, maxCurrentA: 10 }), { coil: ballastCoil(), ballast: ironBallast() }));
    const eq = ironEquilibrium(1.5, 1.5 + HARNESS, V - SAT);
    expect(r.currentA).toBeCloseTo(eq.i, 4);
    expect(r.moduleDissipationW).toBeCloseTo(SAT * eq.i, 4);
    expect(r.ballastDissipationW).toBeCloseTo(eq.i * eq.i * eq.rb, 3);
  });
  it('an iron-wire ballast with its own thermal resistance: a cooler mounting passes more current', () => {
    const at = (theta: number) => keyOn(pointsSetup({ coil: ballastCoil(), ballast: ironBallast({ thermalResistanceKPerW: theta }) })).currentA;
    // With no thermal resistance it stays at the surroundings (80 degC): Ohm's law on the iron's resistance there.
    const rb80 = ironOhm(1.5, UNDER_BONNET_K);
    expect(at(0)).toBeCloseTo(V / (1.5 + HARNESS + CONTACT + rb80), 6);
    expect(at(4)).toBeGreaterThan(at(8));
    expect(at(0)).toBeGreaterThan(at(4));
  });
});
