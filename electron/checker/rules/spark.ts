/**
 * Rules about the spark itself across rpm: energy, voltage reserve, spark rate, off time, plug gap.
 */
import type { Intent } from '../types.js';
import { cdSparkEnergyJ } from '../cd.js';
import { sparkEnergyAt } from '../report-figures.js';
import { inductiveSparkEnergyJ } from '../secondary.js';
import { fig, fmt, isModuleKind, result, type FailTest, type Rule, type RuleContext } from './context.js';

/**
 * Delivered spark energy (the energy the arc receives, Heywood 1988, Internal Combustion Engine
 * Fundamentals, ch. 9), not what the coil or capacitor stores: the two differ by a factor of 3 to 15
 * and by kind (a CD unit hands over little of its 0.5 C V^2 in a short spark).
 * Below DELIVERED_ENERGY_FAIL_J even a good mixture may not light: a stoichiometric mixture at the
 * plug needs around 1 mJ or less (from memory). Below DELIVERED_ENERGY_CAUTION_J a lean or rich
 * mixture or a wet plug, which need several mJ (from memory), may misfire.
 */
export const DELIVERED_ENERGY_FAIL_J = 1e-3;
export const DELIVERED_ENERGY_CAUTION_J = 3e-3;
/**
 * A spark shorter than this gives a lean or slow-burning mixture less time to catch (from memory:
 * an inductive spark lasts 1 to 2 ms, a CD spark 0.1 to 0.3 ms).
 */
export const SPARK_DURATION_CAUTION_S = 0.5e-3;
/** Against the existing setup at the same rpm: under 75 % of its delivered energy, or half its spark duration, is a caution (our limits). */
export const BASELINE_ENERGY_CAUTION_RATIO = 0.75;
export const BASELINE_DURATION_CAUTION_RATIO = 0.5;

/** Delivered energy at a break current (inductive, magneto) or a charge voltage (CD); the same laws as the report's per-point figure. */
function deliveredAt(p: RuleContext['p'], currentOrChargeV: number): number {
  if (p.cd) return cdSparkEnergyJ(p.cd.capacitorF, currentOrChargeV, p.n, p.arcV, p.eta);
  return inductiveSparkEnergyJ(p.secondaryInductanceH, p.secondaryResistanceOhm, (p.eta * currentOrChargeV) / p.n, p.arcV);
}

/**
 * Lowest delivered spark energy from idle to redline and where. The delivered energy rises with the
 * break current (inductive: (V_a^2 Ls / Rs^2)(x - ln(1 + x)), x = Rs I0 / V_a, increasing in I0) and with the
 * charge voltage (CD: linear), and every other term is fixed for the setup, so the lowest is at the
 * lowest current or charge voltage: one evaluation, cheap enough for the search's fail test, and
 * never reading the spark-duration column (which the verdict-only pass may leave out).
 * A point without a spark (available voltage 0) delivers nothing.
 */
export function lowestDeliveredEnergy({ ws, p, idleIndex, redlineIndex }: RuleContext): { value: number; index: number } {
  const key = p.cd ? ws.cdChargeV : ws.currentA;
  let lo = Infinity;
  let index = idleIndex;
  for (let i = idleIndex; i <= redlineIndex; i++) {
    if (!(ws.availableV[i]! > 0)) return { value: 0, index: i };
    const k = key[i]!;
    if (k < lo) { lo = k; index = i; }
  }
  return { value: Number.isFinite(lo) ? deliveredAt(p, lo) : 0, index };
}

export const sparkEnergy: Rule = (ctx) => {
  const { ws, idleIndex, redlineIndex, baseline, grid, p } = ctx;
  const id = 'spark-energy';
  const title = 'Spark energy and duration across rpm';
  const low = lowestDeliveredEnergy(ctx);
  const lowRpm = grid.rpm[low.index]!;
  let shortest = Infinity;
  let shortI = idleIndex;
  for (let i = idleIndex; i <= redlineIndex; i++) {
    const d = ws.durationS[i]!;
    if (ws.availableV[i]! > 0 && d < shortest) { shortest = d; shortI = i; }
  }
  const crankJ = sparkEnergyAt(p, ws, 0);
  const figures = [
    fig('lowest delivered spark energy, idle to redline', low.value * 1000, 'mJ'),
    fig('at rpm', lowRpm, 'rpm'),
    fig('stored in the coil or capacitor there', ws.energyJ[low.index]! * 1000, 'mJ'),
    fig('shortest spark, idle to redline', shortest * 1000, 'ms'),
    fig('shortest at rpm', grid.rpm[shortI]!, 'rpm'),
    fig('delivered spark energy at cranking', crankJ * 1000, 'mJ'),
  ];
  const why = 'What lights the mixture is the energy the spark delivers to the arc and how long the spark lasts (Heywood 1988, ch. 9), not what the coil or capacitor stores; both fall with rpm as the coil has less time to charge.';
  if (low.value < DELIVERED_ENERGY_FAIL_J) {
    if (ws.noSpark[low.index] === 1) {
      return result(id, title, 'fail', figures, `${why} At ${fmt(lowRpm, 0)} rpm the module's own supply is below what it needs to switch, so there is no spark at all.`, 'Give the module the supply it needs (see "Module supply while cranking" and "System voltage"), or choose a module that works at this voltage.', ['feed:improve']);
    }
    const more = lowEnergyAdvice(ctx);
    return result(id, title, 'fail', figures, `${why} It delivers only ${fmt(low.value * 1000, 2)} mJ to the spark at ${fmt(lowRpm, 0)} rpm, below the ${fmt(DELIVERED_ENERGY_FAIL_J * 1000)} mJ that even a good mixture at the plug needs (from memory).`, more.text, more.intents);
  }
  const reasons: string[] = [];
  const actions: string[] = [];
  let intents: Intent[] | undefined;
  if (ws.noSpark[0] === 1) {
    reasons.push("While cranking the module's own supply is below what it needs to switch, so there is no spark to start on.");
    actions.push('Give the module the supply it needs while cranking (see "Module supply while cranking").');
    intents = ['feed:improve'];
  } else if (crankJ < DELIVERED_ENERGY_CAUTION_J) {
    reasons.push(`While cranking it delivers only ${fmt(crankJ * 1000, 2)} mJ to the spark.`);
    actions.push(ctx.setup.ballast !== null && !ctx.setup.crankingBypass && p.kind !== 'capacitive-discharge' ? 'Expect hard starting; check the cranking supply, and consider a cranking bypass past the ballast.' : 'Expect hard starting; check the battery and the cranking supply.');
  }
  let weakRunning = false;
  if (low.value < DELIVERED_ENERGY_CAUTION_J) {
    weakRunning = true;
    reasons.push(`It delivers as little as ${fmt(low.value * 1000, 2)} mJ at ${fmt(lowRpm, 0)} rpm; a lean or rich mixture or a wet plug needs several mJ (from memory, we take ${fmt(DELIVERED_ENERGY_CAUTION_J * 1000)} mJ).`);
  }
  if (shortest < SPARK_DURATION_CAUTION_S) {
    weakRunning = true;
    reasons.push(`Its spark lasts only ${fmt(shortest * 1000, 2)} ms (at ${fmt(grid.rpm[shortI]!, 0)} rpm), where an inductive spark lasts 1 to 2 ms: a short spark gives a lean or slow-burning mixture less time to catch.`);
  }
  if (baseline) {
    let eRel = Infinity;
    let eI = idleIndex;
    let dRel = Infinity;
    let dI = idleIndex;
    for (let i = idleIndex; i <= redlineIndex; i++) {
      const b = baseline.sparkEnergyJ[i]!;
      if (b > 0) {
        const rel = sparkEnergyAt(p, ws, i) / b;
        if (rel < eRel) { eRel = rel; eI = i; }
      }
      const bd = baseline.durationS[i]!;
      if (bd > 0) {
        const rel = ws.durationS[i]! / bd;
        if (rel < dRel) { dRel = rel; dI = i; }
      }
    }
    if (Number.isFinite(eRel)) {
      figures.push(fig(`delivered energy relative to ${baseline.label}, worst`, eRel * 100, '%'), fig('worst at rpm', grid.rpm[eI]!, 'rpm'));
      if (eRel < BASELINE_ENERGY_CAUTION_RATIO) {
        weakRunning = true;
        reasons.push(`At ${fmt(grid.rpm[eI]!, 0)} rpm it delivers ${fmt(eRel * 100, 0)} % of the spark energy of ${baseline.label} (${fmt(sparkEnergyAt(p, ws, eI) * 1000, 2)} mJ against ${fmt(baseline.sparkEnergyJ[eI]! * 1000, 2)} mJ).`);
      }
    }
    if (Number.isFinite(dRel)) {
      figures.push(fig(`spark duration relative to ${baseline.label}, worst`, dRel * 100, '%'), fig('shortest relative at rpm', grid.rpm[dI]!, 'rpm'));
      if (dRel < BASELINE_DURATION_CAUTION_RATIO) {
        weakRunning = true;
        reasons.push(`At ${fmt(grid.rpm[dI]!, 0)} rpm its spark lasts ${fmt(dRel * 100, 0)} % as long as that of ${baseline.label} (${fmt(ws.durationS[dI]! * 1000, 2)} ms against ${fmt(baseline.durationS[dI]! * 1000, 2)} ms).`);
      }
    }
  }
  if (weakRunning) actions.push(weakSparkAdvice(ctx));
  if (reasons.length === 0) return result(id, title, 'pass', figures, why, 'Nothing to do.');
  return result(id, title, 'caution', figures, `${why} ${reasons.join(' ')}`, actions.join(' '), intents);
};

export const sparkEnergyFails: FailTest = (ctx) => lowestDeliveredEnergy(ctx).value < DELIVERED_ENERGY_FAIL_J;

/**
 * What to do about a spark weaker or shorter than it might be, depending on whether the voltage
 * reserve holds (it fires the plug at all) and in the words of the system.
 */
function weakSparkAdvice(ctx: RuleContext): string {
  const { worstRatio, margin, p } = ctx;
  const cd = p.kind === 'capacitive-discharge';
  if (worstRatio >= margin) {
    return `Acceptable: the voltage reserve holds (worst ${fmt(worstRatio, 2)} against the ${fmt(margin, 2)} margin), so it fires the plug; a clean, well-tuned engine runs on it, and a lean mixture at light load, a rich cold start or a wet plug shows the difference first.${cd ? ' A CD unit that fires several sparks at low rpm makes up for its short spark where it matters most.' : ''}`;
  }
  const stronger = cd ? 'choose a CD unit with a larger capacitor or a stronger charger, or an inductive module for a longer spark' : 'choose a coil and module that charge harder at that speed';
  return `Not to be relied on: the voltage reserve does not hold either (worst ${fmt(worstRatio, 2)} against the ${fmt(margin, 2)} margin, see "Voltage reserve"); ${stronger}.`;
}

/** Available against required voltage, with the common-practice margin of 1.25. */
export const voltageReserve: Rule = (ctx) => {
  const { ws, worstRatio, worstIndex, margin, grid, baseline } = ctx;
  const id = 'voltage-reserve';
  const title = 'Voltage reserve';
  const rpm = grid.rpm[worstIndex]!;
  const figures = [
    fig('worst available / required', worstRatio, ''),
    fig('at rpm', rpm, 'rpm'),
    fig('available there', ws.availableV[worstIndex]! / 1000, 'kV'),
    fig('required there', ws.requiredV[worstIndex]! / 1000, 'kV'),
    fig('margin (common practice)', margin, ''),
  ];
  if (baseline) figures.push(fig(`${baseline.label}, worst ratio`, baseline.worstRatio, ''));
  const why = 'The coil must offer more voltage than the gap needs at full load, with room for worn plugs, a damp lead and a wide gap: when it cannot, the engine misfires under load.';
  const where = worstIndex === 0 ? 'while cranking' : `at ${fmt(rpm, 0)} rpm`;
  if (ws.noSpark[worstIndex] === 1) {
    return result(id, title, 'fail', figures, `${why} ${where} the module's own supply is below what it needs to switch, so it offers no voltage at all.`, 'Give the module the supply it needs; no plug gap can make up for a module that does not switch.', ['feed:improve']);
  }
  if (worstRatio < 1) {
    return result(id, title, 'fail', figures, `${why} ${where} it offers ${fmt(ws.availableV[worstIndex]! / 1000)} kV where ${fmt(ws.requiredV[worstIndex]! / 1000)} kV is needed.`, 'Close the plug gap, or choose a coil and module with more output.', ['gap:close']);
  }
  if (worstRatio < margin) {
    return result(id, title, 'caution', figures, `${why} ${where} the reserve ratio is ${fmt(worstRatio, 2)}, under the ${fmt(margin, 2)} margin.`, 'Close the plug gap a little (see the suggested gap) or choose a stronger coil.', ['gap:close']);
  }
  return result(id, title, 'pass', figures, why, 'Nothing to do.');
};

/** Below 1 the coil cannot fire the plug at all somewhere between cranking and redline. */
export const voltageReserveFails: FailTest = (ctx) => ctx.worstRatio < 1;

/** Sparks per second at redline: rpm x cylinders / 120 on a four-stroke, / 60 on a two-stroke. */
const redlineRateHz = ({ engine }: RuleContext): number => (engine.redlineRpm * engine.cylinders) / (engine.cycle === 'two-stroke' ? 60 : 120);

/** The module's highest spark rate against the rate at redline. */
export const sparkRate: Rule = (ctx) => {
  const { engine, setup, grid, redlineIndex } = ctx;
  const id = 'spark-rate';
  const title = 'Spark rate at redline';
  const redlineRate = redlineRateHz(ctx);
  const figures = [fig('spark rate at redline', redlineRate, 'Hz')];
  const m = setup.module;
  // Points float: the follower leaves the cam before redline. A transistor-points unit keeps the
  // points as its trigger (the transistor only carries the coil current), so it floats the same.
  const float = engine.pointsFloatRpm;
  const floats = (ctx.p.kind === 'points' || ctx.p.kind === 'transistor-points') && float !== null && float < engine.redlineRpm;
  const floatWhy = 'The points follower leaves the cam before redline, so the dwell and the spark collapse at the top.';
  const floatAction = 'Stronger points springs, or an electronic trigger, cure points float.';
  if (!isModuleKind(ctx) || !m) {
    if (floats) {
      figures.push(fig('points float from', float, 'rpm'));
      return result(id, title, 'caution', figures, floatWhy, floatAction);
    }
    return result(id, title, 'pass', figures, 'Points have no electronic spark-rate limit.', 'Nothing to do.');
  }
  figures.push(fig('module limit', m.maxSparkRateHz, 'Hz'));
  void grid; void redlineIndex;
  const why = 'Above its highest spark rate a module skips sparks, which feels like hitting a rev limiter.';
  if (redlineRate > m.maxSparkRateHz) return result(id, title, 'fail', figures, `${why} Redline needs ${fmt(redlineRate, 0)} sparks a second against a limit of ${fmt(m.maxSparkRateHz, 0)}.`, 'Choose a module rated for this engine\'s redline.');
  if (floats) {
    figures.push(fig('points float from', float, 'rpm'));
    return result(id, title, 'caution', figures, `The module still takes its timing from the points. ${floatWhy}`, floatAction);
  }
  if (redlineRate > 0.9 * m.maxSparkRateHz) return result(id, title, 'caution', figures, `${why} Redline comes within 10 % of the limit.`, 'Keep clear of redline, or choose a faster module.');
  return result(id, title, 'pass', figures, why, 'Nothing to do.');
};

export const sparkRateFails: FailTest = (ctx) => {
  const m = ctx.setup.module;
  return isModuleKind(ctx) && m !== null && redlineRateHz(ctx) > m.maxSparkRateHz;
};

/** Off time under this fraction of the spark duration cuts most of the spark away (our limit). */
export const OFF_TIME_FAIL_RATIO = 0.3;

/** Least off time / spark duration from cranking to redline, and where (Infinity if no spark). */
function leastOffTimeRatio({ ws, redlineIndex }: RuleContext): { worst: number; wi: number } {
  let worst = Infinity;
  let wi = 0;
  for (let i = 0; i <= redlineIndex; i++) {
    const d = ws.durationS[i]!;
    if (d > 0) {
      const r = ws.offS[i]! / d;
      if (r < worst) { worst = r; wi = i; }
    }
  }
  return { worst, wi };
}

/** Off time (switch open) against the spark duration: a coil switched on mid-spark cuts it short. */
export const offTime: Rule = (ctx) => {
  const { ws, grid, p } = ctx;
  const id = 'off-time';
  const title = 'Time for the spark';
  const { worst, wi } = leastOffTimeRatio(ctx);
  if (!Number.isFinite(worst)) return result(id, title, 'pass', [], 'No spark duration to compare.', 'Nothing to do.');
  const figures = [fig('least off time / spark duration', worst, ''), fig('at rpm', grid.rpm[wi]!, 'rpm'), fig('off time there', ws.offS[wi]! * 1000, 'ms'), fig('spark duration there', ws.durationS[wi]! * 1000, 'ms')];
  const why = 'The coil can only be switched on again once the spark has burnt out; closing earlier cuts the spark short and wastes its energy.';
  if (p.kind === 'capacitive-discharge') return result(id, title, 'pass', figures, 'A CD spark is short and the coil is not charged between sparks.', 'Nothing to do.');
  const shorter = shorterDwellWords(ctx);
  if (worst < OFF_TIME_FAIL_RATIO) return result(id, title, 'fail', figures, `${why} At ${fmt(grid.rpm[wi]!, 0)} rpm the switch closes before a third of the spark has burnt.`, `${shorter.fail}, or choose a coil with a shorter spark.`, ['dwell:shorter']);
  if (worst < 1) return result(id, title, 'caution', figures, `${why} At ${fmt(grid.rpm[wi]!, 0)} rpm the switch closes before the spark ends.`, `Usually harmless near redline; ${shorter.caution} would cure it.`, ['dwell:shorter']);
  return result(id, title, 'pass', figures, why, 'Nothing to do.');
};

export const offTimeFails: FailTest = (ctx) => ctx.p.kind !== 'capacitive-discharge' && leastOffTimeRatio(ctx).worst < OFF_TIME_FAIL_RATIO;

/** The current gap against the suggested one and the plug's recommended range. */
export const plugGap: Rule = (ctx) => {
  const { setup, gap } = ctx;
  const id = 'plug-gap';
  const title = 'Plug gap';
  const gapMm = setup.plugGapM * 1000;
  const figures = [fig('gap set', gapMm, 'mm')];
  const plug = setup.plug;
  if (plug) figures.push(fig('plug range from', plug.gapMinM * 1000, 'mm'), fig('plug range to', plug.gapMaxM * 1000, 'mm'));
  const why = 'A wider gap gives a bigger, surer flame kernel but needs more voltage; the widest gap the coil still fires with margin is the best compromise.';
  if (plug && setup.plugGapM < plug.gapMinM * 0.999) {
    return result(id, title, 'caution', figures, `${why} The gap set is closer than the plug's recommended range.`, `Open the gap to at least ${fmt(plug.gapMinM * 1000, 2)} mm, the plug's smallest.`, ['gap:widen']);
  }
  if (plug && setup.plugGapM > plug.gapMaxM * 1.001) {
    return result(id, title, 'caution', figures, `${why} The gap set is wider than the plug's recommended range.`, `Close the gap to at most ${fmt(plug.gapMaxM * 1000, 2)} mm, the plug's largest.`, ['gap:close']);
  }
  if (!gap) return result(id, title, 'pass', figures, why, 'No gap suggestion was computed.');
  if (gap.suggestedGapM === null) {
    if (anyNoSpark(ctx)) {
      return result(id, title, 'caution', figures, `${why} Where the module's supply is too low for it to switch there is no spark at any gap.`, 'Give the module the supply it needs first; then look at the gap again.', ['feed:improve']);
    }
    return result(id, title, 'caution', figures, `${why} No gap from ${fmt(gap.searchedFromM * 1000, 2)} to ${fmt(gap.searchedToM * 1000, 2)} mm meets the ${fmt(gap.marginRatio, 2)} margin.`, 'Use the smallest recommended gap and look at the voltage reserve rule.', ['gap:close']);
  }
  figures.push(fig('suggested gap', gap.suggestedGapM * 1000, 'mm'));
  if (setup.plugGapM > gap.suggestedGapM * 1.001) {
    return result(id, title, 'caution', figures, `${why} The gap set is wider than the ${fmt(gap.suggestedGapM * 1000, 2)} mm that keeps the margin.`, `Close the gap to ${fmt(gap.suggestedGapM * 1000, 2)} mm.`, ['gap:close']);
  }
  return result(id, title, 'pass', figures, why, `The gap set keeps the margin; up to ${fmt(gap.suggestedGapM * 1000, 2)} mm would too.`);
};

/** The plug-gap rule advises only; it never fails. */
export const plugGapFails: FailTest = () => false;

/** Whether the module fails to switch anywhere from cranking to redline. */
function anyNoSpark({ ws, redlineIndex }: RuleContext): boolean {
  for (let i = 0; i <= redlineIndex; i++) if (ws.noSpark[i] === 1) return true;
  return false;
}

/**
 * A shorter dwell in the words of the system: points (and a points-triggered transistor unit, and
 * a magneto's contact breaker) have a dwell angle set by the points gap, not a duty; a fixed-duty
 * module has its fixed duty, a current-limited one its maximum duty.
 */
function shorterDwellWords({ p }: RuleContext): { fail: string; caution: string } {
  if (p.kind === 'breakerless-fixed-duty') return { fail: 'Choose a module with a lower fixed duty', caution: 'a module with a lower fixed duty' };
  if (p.kind === 'breakerless-current-limited') return { fail: 'Choose a module with a lower maximum duty', caution: 'a lower maximum duty' };
  return { fail: 'Set the dwell at the low end of its range (a slightly wider points gap)', caution: 'a slightly smaller dwell (a slightly wider points gap)' };
}

/** What raises a falling spark energy, in the words of the system. */
function lowEnergyAdvice({ p }: RuleContext): { text: string; intents: Intent[] } {
  if (p.kind === 'capacitive-discharge') return { text: 'Choose a capacitive-discharge unit with a stronger charger or a larger capacitor.', intents: [] };
  if (p.kind === 'magneto') return { text: 'Have the magneto\'s magnet recharged and its armature tested; a tired magneto is the usual cause.', intents: [] };
  if (p.kind === 'points' || p.kind === 'transistor-points') {
    return { text: 'Choose a coil of lower inductance or resistance, or set the dwell at the top of its range (a slightly closer points gap).', intents: ['coil-resistance:lower', 'dwell:longer'] };
  }
  return { text: 'Choose a coil of lower inductance or resistance, or a module that charges it longer.', intents: ['coil-resistance:lower', 'dwell:longer'] };
}
