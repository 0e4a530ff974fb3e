/**
 * Points float on a transistor-points unit. Trade fact (common practice): a points-triggered
 * transistor unit keeps the contact breaker as its trigger and only relieves the points of the coil
 * current, so the follower still leaves the cam at the same speed as on plain points; a breakerless
 * trigger is what cures float. The rate at redline: rpm x cylinders / 120 on a four-stroke.
 */
import { describe, expect, it } from 'vitest';
import { checkSetup } from '../../electron/checker/index.js';
import { fourCylinder, module, moduleSetup, pointsSetup } from './fixtures.js';

const opts = { rpmPoints: 12, skipGapSuggestion: true };
const floating = { ...fourCylinder, pointsFloatRpm: 5500 }; // redline 6000 rpm
const rule = (engine: typeof fourCylinder, setup: ReturnType<typeof pointsSetup>) => checkSetup(engine, setup, undefined, opts).rules.find((r) => r.id === 'spark-rate')!;
const transistor = (maxSparkRateHz: number) => moduleSetup(module({ moduleType: 'transistor-points', currentLimitA: null, maxDutyFraction: null, maxSparkRateHz }));

describe('points float behind a transistor-points unit', () => {
  it('cautions as on plain points when the points float below redline', () => {
    const plain = rule(floating, pointsSetup());
    const t = rule(floating, transistor(400));
    expect(plain.verdict).toBe('caution');
    expect(t.verdict).toBe('caution');
    expect(t.why).toBe('The module still takes its timing from the points. The points follower leaves the cam before redline, so the dwell and the spark collapse at the top.');
    expect(t.action).toBe(plain.action);
    // 6000 x 4 / 120 = 200 Hz at redline, the module's 400 Hz limit, and the float speed.
    expect(t.figures.map((f) => [f.name, f.value, f.unit])).toEqual([
      ['spark rate at redline', (6000 * 4) / 120, 'Hz'],
      ['module limit', 400, 'Hz'],
      ['points float from', 5500, 'rpm'],
    ]);
  });
  it('passes when the points float only above redline, and a breakerless module never floats', () => {
    expect(rule({ ...fourCylinder, pointsFloatRpm: 6500 }, transistor(400)).verdict).toBe('pass');
    expect(rule(floating, moduleSetup(module())).verdict).toBe('pass');
  });
  it('still fails a module too slow for redline, float or not', () => {
    // 200 Hz needed against a 150 Hz limit.
    const t = rule(floating, transistor(150));
    expect(t.verdict).toBe('fail');
    expect(t.why).toMatch(/Redline needs 200 sparks a second against a limit of 150\./);
  });
});
