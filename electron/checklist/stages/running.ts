/**
 * Running: the charging supply at fast idle, the dwell at idle (none for capacitive discharge),
 * the tachometer against a second reference, and the timing at idle and on the advance curve.
 */
import { dwellCauses, runningSupplyCauses, tachCauses, timingAdvancedCauses, timingIdleCauses } from '../causes.js';
import type { SheetContext } from '../context.js';
import { advanceCheckRow, band, idleDwell, runningSupply } from '../expected.js';
import { checkStep } from '../step.js';
import type { SheetStage, SheetStep } from '../types.js';
import { batteryProbes, num, probesToEarth, provenanceWords } from '../words.js';

function supply(ctx: SheetContext): SheetStep {
  const w = ctx.words;
  const f = runningSupply(ctx);
  const gen = ctx.input.about.charging === 'dynamo' ? 'dynamo' : 'alternator';
  const prov = ctx.input.conditions.runningSupplyV.provenance;
  return checkStep('running', 'supply', 'Battery at fast idle', `Hold the engine at a fast idle (about 1500 rpm) and measure across the battery posts: the ${gen} should be charging.`, [w.t30, w.t31], {
    quantity: 'supply-voltage-running',
    ...f,
    probes: batteryProbes(ctx.positiveEarth),
    state: `Engine at a fast idle, warm, ${gen} charging, lights off.`,
    how: `the checker's running supply, ${num(f.expected)} V (${provenanceWords(prov)}); a ${ctx.six ? '6' : '12'} V ${gen} charges at ${num(f.min)} to ${num(f.max)} V.`,
    source: 'common practice',
    ifOutOfRange: runningSupplyCauses(ctx),
  });
}

function dwell(ctx: SheetContext): SheetStep | null {
  const d = idleDwell(ctx);
  if (!d) return null;
  const w = ctx.words;
  const cyl = ctx.engine.cylinders;
  let how: string;
  let source: string;
  if (d.basis === 'points') {
    how = `the engine's points dwell, ${num(d.degrees, 1)} distributor degrees; +/- 2 degrees (common practice).`;
    source = 'engine record';
  } else if (d.basis === 'fixed-duty') {
    how = `duty ${num(d.fraction, 3)} x 360 / ${cyl} cylinders = ${num(d.degrees, 1)} distributor degrees; +/- 2 degrees (common practice).`;
    source = 'module data';
  } else {
    const idle = ctx.report.keyPoints.idle;
    how = `the checker's dwell at idle, ${num(idle.dwellTimeS * 1000, 2)} ms of a ${num(idle.periodS * 1000, 2)} ms period (capped at the module's maximum duty ${num(ctx.module?.maxDutyFraction ?? 1, 2)}) = duty ${num(d.fraction, 3)} x 360 / ${cyl} = ${num(d.degrees, 1)} distributor degrees; +/- ${num(d.tolerance, 1)} degrees (15 %, at least 2; from memory).`;
    source = 'checker';
  }
  return checkStep('running', 'dwell', 'Dwell at idle', `With the engine idling, read the dwell meter (set for ${cyl} cylinders).`, [w.coil1, w.t31], {
    quantity: 'dwell-angle',
    expected: d.degrees,
    min: d.degrees - d.tolerance,
    max: d.degrees + d.tolerance,
    probes: `Dwell meter: ${probesToEarth(w.coil1, ctx.positiveEarth)}`,
    state: `Engine warm and idling at about ${num(ctx.engine.idleRpm, 0)} rpm.`,
    how,
    source,
    ifOutOfRange: dwellCauses(ctx),
  });
}

function tach(ctx: SheetContext): SheetStep | null {
  if (!ctx.tach) return null;
  const f = band(ctx.engine.idleRpm, 0.05);
  return checkStep('running', 'tach', 'Tachometer at idle', `Compare the car's tachometer (${ctx.tach.name}) at idle with a second reference: a hand-held tachometer or a strobe with an rpm readout.`, [ctx.words.tachWire], {
    quantity: 'tach-idle-rpm',
    ...f,
    probes: 'Read the car\'s tachometer while the reference reads the engine; write down the car\'s reading.',
    state: `Engine warm and idling at about ${num(ctx.engine.idleRpm, 0)} rpm (set by the reference).`,
    how: `the engine's idle speed, ${num(f.expected, 0)} rpm; +/- 5 % (common practice).`,
    source: 'common practice',
    ifOutOfRange: tachCauses(),
  });
}

function timing(ctx: SheetContext): SheetStep[] {
  const e = ctx.engine;
  const out: SheetStep[] = [
    checkStep('running', 'timing-idle', 'Timing at idle', 'With the vacuum pipe off and plugged, shine the strobe on the timing marks at idle.', ['strobe pickup on the number 1 plug lead'], {
      quantity: 'timing-idle',
      expected: e.staticTimingDegBtdc,
      min: e.staticTimingDegBtdc - 2,
      max: e.staticTimingDegBtdc + 2,
      probes: 'Strobe pickup clamped on the number 1 plug lead, its supply on the battery.',
      state: `Engine warm, idling at about ${num(e.idleRpm, 0)} rpm, vacuum advance disconnected.`,
      how: `the engine's static timing, ${num(e.staticTimingDegBtdc, 1)} crank degrees BTDC; +/- 2 degrees (common practice).`,
      source: 'engine record',
      ifOutOfRange: timingIdleCauses(),
    }),
  ];
  const row = advanceCheckRow(ctx);
  if (row) {
    const deg = e.staticTimingDegBtdc + row.advanceDeg;
    out.push(
      checkStep('running', 'timing-advanced', `Timing at ${num(row.rpm, 0)} rpm`, `Raise the speed to ${num(row.rpm, 0)} rpm (read on the reference) and read the timing again.`, ['strobe pickup on the number 1 plug lead'], {
        quantity: 'timing-advanced',
        expected: deg,
        min: deg - 2,
        max: deg + 2,
        probes: 'Strobe pickup on the number 1 plug lead, as before.',
        state: `Engine warm at ${num(row.rpm, 0)} rpm, vacuum advance disconnected.`,
        how: `static ${num(e.staticTimingDegBtdc, 1)} + the curve's ${num(row.advanceDeg, 1)} at ${num(row.rpm, 0)} rpm = ${num(deg, 1)} crank degrees BTDC; +/- 2 degrees (common practice).`,
        source: 'engine record',
        ifOutOfRange: timingAdvancedCauses(),
      }),
    );
  }
  return out;
}

export function runningStage(ctx: SheetContext): SheetStage {
  return {
    id: 'running',
    title: 'Running',
    intro: 'Engine running in the open air, handbrake on, in neutral; keep clear of the fan, belts and HT leads.',
    steps: [supply(ctx), dwell(ctx), tach(ctx), ...timing(ctx)].filter((s): s is SheetStep => s !== null),
  };
}
