/**
 * The two checker requests over the store: `check.plans` (the existing setup beside up to three
 * plans) and `check.search` (the best combinations from the whole parts bin). Stored records go
 * through the adapter (`electron/setup/`), whose readings win over catalogue values; the reports
 * come back trimmed by `check-view.ts`. The adapter's and checker's own errors become AppFailures
 * with their plain sentence; the store's errors are left for the caller's guard to translate.
 */
import type { Engine, Part, Plan, Reading } from '../../db/schema.js';
import type { Repositories } from '../../db/repositories/index.js';
import { compareSetups, searchBest, CheckerInputError, type SearchInput, type SearchResult } from '../checker/index.js';
import { ignitionCautions } from '../safety/cautions.js';
import { comparisonInput, latestReading, searchInput, SetupAdapterError } from '../setup/index.js';
import type { ComparisonAnswer, SearchAnswer, ShownFigure } from './check-shapes.js';
import { shownConditions, shownSetup } from './check-view.js';
import { AppFailure } from './failure.js';
import { shelfStock } from './shelf-stock.js';

const cautions = (): ComparisonAnswer['cautions'] => ignitionCautions.map((c) => ({ id: c.id, text: c.text }));

/** Runs adapter and checker code, turning their errors into the bridge's codes and sentences. */
export function adapting<T>(body: () => T): T {
  try {
    return body();
  } catch (err) {
    if (err instanceof SetupAdapterError) throw new AppFailure(err.code, err.message);
    if (err instanceof CheckerInputError) throw new AppFailure('INVALID_INPUT', err.message);
    throw err;
  }
}

function measuredGap(readings: readonly Reading[]): ShownFigure[] {
  const r = latestReading(readings, 'plug-gap');
  return r && r.value > 0 && r.value <= 3 ? [{ name: 'plug gap', value: r.value, unit: 'mm', measured: true, source: 'measured' }] : [];
}

export function checkPlans(repos: Repositories, req: { engineId: number; planIds: number[]; conditions?: Engine['conditions'] | undefined }): ComparisonAnswer {
  const stored = repos.engines.get(req.engineId);
  const engine: Engine = req.conditions ? { ...stored, conditions: req.conditions } : stored;
  const plans: Plan[] = req.planIds.map((id) => repos.plans.get(id));
  for (const p of plans) {
    if (p.engineId !== engine.id) {
      throw new AppFailure('INVALID_INPUT', `The plan “${p.name}” is for another engine, so it cannot be weighed against ${engine.name}.`, { planIds: 'Tick only plans for this engine.' });
    }
  }
  const parts: Part[] = repos.parts.list();
  const readings = new Map(plans.map((p) => [p.id, repos.readings.list(p.id)] as const));
  return adapting(() => {
    const input = comparisonInput(engine, plans, parts, readings);
    const report = compareSetups(input);
    return {
      engineId: engine.id,
      engineName: engine.name,
      marginRatio: report.conditions.marginRatio.value,
      conditions: shownConditions(report.conditions),
      existing: shownSetup(report.existing, { kind: 'existing', planId: null, plugGapM: input.existing.plugGapM, name: 'Fitted now' }),
      candidates: report.candidates.map((c, i) =>
        shownSetup(c, { kind: 'plan', planId: plans[i]!.id, plugGapM: input.candidates[i]!.plugGapM }, measuredGap(readings.get(plans[i]!.id) ?? [])),
      ),
      cautions: cautions(),
    };
  });
}

/** A plan name of at most 120 characters (the store's limit). */
function planNameOf(label: string): string {
  const t = label.trim() || 'Combination from the shelf';
  return t.length <= 120 ? t : `${t.slice(0, 119).trimEnd()}…`;
}

/**
 * `run` does the search itself: in the app a worker thread (search-runner.ts), so every other
 * request keeps answering meanwhile; by default in this thread (the command line, tests of the answer).
 */
export async function searchShelf(
  repos: Repositories,
  req: { engineId: number; top?: number | undefined },
  run: (input: SearchInput) => Promise<SearchResult> = async (input) => searchBest(input),
): Promise<SearchAnswer> {
  const engine = repos.engines.get(req.engineId);
  // Parts that plans marked as fitted on other engines use up are left out (shelf-stock.ts).
  const engineNames = new Map(repos.engines.list().map((e) => [e.id, e.name] as const));
  const stock = shelfStock(engine, repos.parts.list(), repos.plans.list(), engineNames);
  const parts: Part[] = stock.free;
  // The same order searchInput uses, so the search's indices name these parts.
  const coils = parts.filter((p) => p.kind === 'coil');
  const modules = parts.filter((p) => p.kind === 'module');
  const ballasts = parts.filter((p) => p.kind === 'ballast');
  const tachs = parts.filter((p) => p.kind === 'tach');
  const leadsParts = parts.filter((p) => p.kind === 'leads');
  const plugs = parts.filter((p) => p.kind === 'plug');
  const input = adapting(() => searchInput(engine, parts, req.top ?? 5));
  let result: SearchResult;
  try {
    result = await run(input);
  } catch (err) {
    return adapting(() => {
      throw err;
    });
  }
  return adapting(() => {
    const titles = new Map<string, string>();
    for (const t of result.top) for (const r of t.report.rules) titles.set(r.id, r.title);
    const margin = result.top[0]?.report.inputs.find((f) => f.name === 'marginRatio')?.value ?? 1.25;
    return {
      engineId: engine.id,
      engineName: engine.name,
      marginRatio: margin,
      evaluated: result.evaluated,
      withoutFail: result.withoutFail,
      suggestions: result.top.map((t, i) => {
        const mod = modules[t.moduleIndex]!;
        const coil = coils[t.coilIndex]!;
        const ballast = t.ballastIndex >= 0 ? ballasts[t.ballastIndex]! : null;
        return {
          rank: i + 1,
          moduleId: mod.id,
          moduleName: mod.name,
          coilId: coil.id,
          coilName: coil.name,
          ballastId: ballast?.id ?? null,
          ballastName: ballast?.name ?? null,
          crankingBypass: t.crankingBypass,
          // Parts from the shelf fitted instead of today's, where today's would fail (null: keep today's).
          tachId: t.tachIndex >= 0 ? tachs[t.tachIndex]!.id : null,
          leadsId: t.leadsIndex >= 0 ? leadsParts[t.leadsIndex]!.id : null,
          plugId: t.plugIndex >= 0 ? plugs[t.plugIndex]!.id : null,
          planName: planNameOf(t.report.label),
          setup: shownSetup(t.report, { kind: 'suggestion', planId: null, plugGapM: input.plugGapM }),
        };
      }),
      rejectedByRule: Object.entries(result.rejectedByRule)
        .map(([id, count]) => ({ id, title: titles.get(id) ?? id, count: count ?? 0 }))
        .sort((a, b) => b.count - a.count),
      cautions: cautions(),
      leftOut: stock.leftOut,
    };
  });
}
