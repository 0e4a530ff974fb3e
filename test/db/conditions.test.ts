/**
 * The working conditions a person may set per engine (db/conditions.ts -> conditionOverrides in
 * db/schema.ts): every key optional, a value outside its plausible range refused with a sentence
 * on that field, an unknown key refused, what the store always accepted still readable, and the
 * defaults shown beside an empty box the same the checker uses. Store checks run on a real SQLite
 * file.
 */
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { conditionUnits, defaultConditions } from '../../electron/checker/conditions.js';
import type { ConditionName, EngineSpec } from '../../electron/checker/types.js';
import { StoreError } from '../../db/errors.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { conditionByKey, conditionDescriptors, conditionKeys, conditionOverrides, engineInput, toStored, toTyped } from '../../db/schema.js';
import { engineIn, tempDir } from './samples.js';

const cleanups: Array<() => void> = [];
afterEach(() => {
  while (cleanups.length) cleanups.pop()!();
});

function fileStore() {
  const t = tempDir('conditions');
  const db = openStore(join(t.dir, 'workshop.sqlite3'));
  cleanups.push(() => {
    closeStore(db);
    t.cleanup();
  });
  return createRepositories(db);
}

const engineSpecFor = (systemVoltageV: 6 | 12): EngineSpec =>
  ({ name: 'x', cylinders: 4, cycle: 'four-stroke', boreM: 0.08, strokeM: 0.08, conRodM: 0.13, compressionRatio: 8.5, idleRpm: 800, crankingRpm: 200, redlineRpm: 6000, systemVoltageV, earthPolarity: 'negative', pointsDwellDeg: 54, pointsFloatRpm: null, staticTimingDegBtdc: 8, advanceCurve: [] }) as EngineSpec;

describe('the working-condition descriptors', () => {
  it('list each condition once', () => {
    expect(new Set(conditionKeys).size).toBe(conditionKeys.length);
    expect(conditionDescriptors.map((d) => d.key)).toEqual([...conditionKeys]);
  });

  it('give the same default and label as the checker, for 6 V and 12 V cars on a mild and a cold morning', () => {
    for (const v of [6, 12] as const) {
      for (const ambientC of [20, -18, 35]) {
        const checker = defaultConditions(engineSpecFor(v), ambientC);
        for (const d of conditionDescriptors) {
          const mine = d.byDefault({ systemVoltageV: v, ambientC });
          const theirs = checker[d.key as ConditionName];
          // ambientC's own default is 20 degC; the checker echoes the ambient it was given.
          if (d.key === 'ambientC') {
            expect(mine).toEqual({ value: 20, source: 'default (common practice)' });
            continue;
          }
          expect(mine.value, `${d.key} at ${v} V, ${ambientC} degC`).toBeCloseTo(theirs.value, 12);
          expect(mine.source, d.key).toBe(theirs.provenance);
        }
      }
    }
  });

  it('give the cranking default from the battery load-test table printed in workshop manuals', () => {
    const crank = conditionByKey.crankingSupplyV;
    // Workshop manuals' load-test pass floor: 8.5 V at -18 degC, 9.4 V at 10 degC, 9.6 V at 21 degC.
    expect(crank.byDefault({ systemVoltageV: 12, ambientC: -18 }).value).toBeCloseTo(8.5, 12);
    // 20 degC lies between 10 degC (9.4 V) and 21 degC (9.6 V): 9.4 + 0.2 x 10/11 = 9.58182 V.
    expect(crank.byDefault({ systemVoltageV: 12, ambientC: 20 }).value).toBeCloseTo(9.4 + (0.2 * 10) / 11, 9);
    // A 6 V battery: half the 12 V floor (from memory): 4.25 V at -18 degC.
    expect(crank.byDefault({ systemVoltageV: 6, ambientC: -18 }).value).toBeCloseTo(4.25, 12);
  });

  it('convert the typed unit to the stored SI unit with the SI prefixes (BIPM, The International System of Units, 9th ed., table 7)', () => {
    // kilo = 10^3, milli = 10^-3, pico = 10^-12; degree Celsius, ohm, volt, watt, K/W and rpm are stored as typed.
    const prefix: Record<string, { si: string; factor: number }> = {
      V: { si: 'V', factor: 1 },
      kV: { si: 'V', factor: 1e3 },
      Ω: { si: 'ohm', factor: 1 },
      kΩ: { si: 'ohm', factor: 1e3 },
      '°C': { si: 'degC', factor: 1 },
      kPa: { si: 'Pa', factor: 1e3 },
      pF: { si: 'F', factor: 1e-12 },
      ms: { si: 's', factor: 1e-3 },
      W: { si: 'W', factor: 1 },
      'K/W': { si: 'K/W', factor: 1 },
      rpm: { si: 'rpm', factor: 1 },
      '': { si: '', factor: 1 },
    };
    const checkerUnits = conditionUnits as Record<string, string>;
    for (const d of conditionDescriptors) {
      const p = prefix[d.unit];
      expect(p, `${d.key}: unit ${d.unit}`).toBeDefined();
      expect(checkerUnits[d.key], d.key).toBe(p!.si);
      expect(d.perUnit, d.key).toBe(p!.factor);
    }
    // 101.325 kPa is one standard atmosphere, 101 325 Pa (ISO 2533).
    expect(toStored(conditionByKey.ambientPressurePa, 101.325)).toBe(101_325);
    // 70 pF = 70 x 10^-12 F, and back without float noise.
    expect(toStored(conditionByKey.secondaryCapacitanceF, 70)).toBe(7e-11);
    expect(toTyped(conditionByKey.secondaryCapacitanceF, 7e-11)).toBe(70);
    expect(toTyped(conditionByKey.currentLimitHoldS, 0.5e-3)).toBe(0.5);
  });

  it('hold every default inside its own plausible range', () => {
    for (const v of [6, 12] as const) {
      for (const d of conditionDescriptors) {
        const x = d.byDefault({ systemVoltageV: v, ambientC: 20 }).value;
        expect(d.minExclusive ? x > d.min : x >= d.min, `${d.key} ${x} >= ${d.min}`).toBe(true);
        expect(x, d.key).toBeLessThanOrEqual(d.max);
      }
    }
  });
});

describe('conditionOverrides', () => {
  it('takes any subset, each key optional', () => {
    expect(conditionOverrides.parse({})).toEqual({});
    expect(conditionOverrides.parse({ ambientC: -18 })).toEqual({ ambientC: -18 });
    const every = Object.fromEntries(conditionDescriptors.map((d) => [d.key, d.byDefault({ systemVoltageV: 12, ambientC: 20 }).value]));
    expect(conditionOverrides.parse(every)).toEqual(every);
  });

  it('refuses a value outside the range, naming the field and the range in the typed unit', () => {
    for (const d of conditionDescriptors) {
      const below = d.minExclusive ? d.min : d.min - Math.max(Math.abs(d.min) * 0.01, 1e-15);
      const above = d.max + Math.max(Math.abs(d.max) * 0.01, 1e-15);
      for (const bad of [below, above]) {
        const r = conditionOverrides.safeParse({ [d.key]: bad });
        expect(r.success, `${d.key} = ${bad}`).toBe(false);
        const issue = r.error!.issues[0]!;
        expect(issue.path).toEqual([d.key]);
        expect(issue.message).toContain(d.label);
        expect(issue.message).toContain(`${toTyped(d, d.max)}${d.unit ? ` ${d.unit}` : ''}`);
      }
      expect(conditionOverrides.safeParse({ [d.key]: d.max }).success, `${d.key} at its top`).toBe(true);
    }
    // The message speaks the typed unit and names the file's SI key where they differ.
    const p = conditionOverrides.safeParse({ ambientPressurePa: 101.3 });
    expect(p.error!.issues[0]!.message).toBe(
      'Air pressure must be from 50 to 110 kPa (in the file, ambientPressurePa from 50000 to 110000). Sea level is 101.3 kPa; 50 kPa is higher than any road.',
    );
  });

  it('refuses a value that is not a finite number', () => {
    for (const bad of ['cold', Number.NaN, Number.POSITIVE_INFINITY, null]) {
      const r = conditionOverrides.safeParse({ ambientC: bad });
      expect(r.success).toBe(false);
      expect(r.error!.issues[0]!.path).toEqual(['ambientC']);
    }
  });

  it('refuses an unknown key, and a condition the checker no longer has', () => {
    const r = conditionOverrides.safeParse({ ambiantC: 5 });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.message).toContain('Unknown working condition "ambiantC"');
    // The fixed CD rise rate was dropped from the model: it must not be quietly kept and ignored.
    expect(conditionOverrides.safeParse({ cdRiseRateVPerS: 5e9 }).success).toBe(false);
  });

  it('still reads every value the store accepted before the list grew (no saved engine becomes unreadable)', () => {
    // The earlier schema: running and cranking supply above 0 and up to 20 V, loom 0 to 5 ohm,
    // ambient -40 to 60 degC, under-bonnet -40 to 150 degC, volumetric efficiency 0.3 to 1.3.
    const edges = [
      { runningSupplyV: 20, crankingSupplyV: 20, harnessResistanceOhm: 5, ambientC: 60, underBonnetC: 150, volumetricEfficiency: 1.3 },
      { runningSupplyV: 0.1, crankingSupplyV: 0.1, harnessResistanceOhm: 0, ambientC: -40, underBonnetC: -40, volumetricEfficiency: 0.3 },
    ];
    for (const e of edges) expect(conditionOverrides.parse(e)).toEqual(e);
  });
});

describe('the store keeps an engine’s working conditions', () => {
  it('stores and reads back every condition set, in SI units, on a real SQLite file', () => {
    const repos = fileStore();
    // A cold morning at altitude: -18 degC and 84 kPa (the standard atmosphere near 1,550 m, ISO 2533, from memory).
    const conditions = { ...engineIn().conditions, ambientC: -18, ambientPressurePa: 84_000, secondaryCapacitanceF: 9e-11, couplingK: 0.99, dynamoCutInRpm: 1200, marginRatio: 1.4 };
    const created = repos.engines.create({ ...engineIn(), conditions });
    expect(repos.engines.get(created.id).conditions).toEqual(conditions);
  });

  it('refuses an out-of-range or unknown condition with the field named, and loses nothing saved', () => {
    const repos = fileStore();
    const created = repos.engines.create({ ...engineIn(), conditions: { ambientC: 5 } });
    const tryUpdate = (conditions: Record<string, number>): StoreError => {
      try {
        repos.engines.update(created.id, { ...engineIn(), conditions } as never, created.updatedAt);
      } catch (e) {
        return e as StoreError;
      }
      throw new Error('the update was accepted');
    };
    const tooCold = tryUpdate({ ambientC: -60 });
    expect(tooCold.code).toBe('INVALID_INPUT');
    expect(tooCold.fields?.['conditions.ambientC']).toMatch(/^Air temperature must be from -40 to 60 °C/);
    const unknown = tryUpdate({ ambientC: 5, inletTempC: 40 });
    expect(unknown.code).toBe('INVALID_INPUT');
    expect(unknown.fields?.['conditions']).toContain('"inletTempC"');
    expect(repos.engines.get(created.id).conditions).toEqual({ ambientC: 5 });
  });

  it('lets the engine form’s schema see the same refusals (the editor checks with engineInput)', () => {
    const r = engineInput.safeParse({ ...engineIn(), conditions: { polytropicIndex: 1.6 } });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join('.'))).toContain('conditions.polytropicIndex');
  });
});
