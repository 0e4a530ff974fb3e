/**
 * Bringing a workshop file (or a CSV's parts) into a store that may already hold records.
 *
 * Matching, as the demo loader does: a part by kind and name, an engine by name, a plan by name
 * within its engine. A match with the same fields (the name itself, or a copy an earlier import
 * renamed, "<name> (imported)") is skipped and the stored one used, so the file's references land
 * on it; a match with different fields is added under a new name, "<name> (imported)" (numbered if
 * that is taken too), so nothing stored is ever overwritten and a second import adds nothing.
 * A skipped plan's readings and ticks are not added (the stored plan keeps its own).
 *
 * `previewImport` answers what `applyImport` will do without writing; `applyImport` does it in
 * one transaction (any failure rolls all of it back).
 */
import { StoreError } from '../errors.js';
import type { Repositories } from '../repositories/index.js';
import type { createTickTimes } from '../repositories/tick-times.js';
import { engineInput, partInput, planInput, type EngineInput, type PartInput, type PartKind, type PlanInput } from '../schema.js';
import { PART_REFS_ENGINE, PART_REFS_PLAN, type WorkshopFile } from './format.js';

export type ImportOutcome = 'added' | 'skipped' | 'renamed';
export type ImportItem = { record: 'part' | 'engine' | 'plan'; name: string; outcome: ImportOutcome; newName?: string; kind?: PartKind; engine?: string };
export type ImportSummary = {
  added: { parts: number; engines: number; plans: number; readings: number; ticks: number };
  skipped: number;
  renamed: number;
  items: ImportItem[];
};

/** Objects compared by content: keys sorted, absent and null treated alike. */
function canonical(value: unknown): string {
  const norm = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(norm);
    if (typeof v === 'object' && v !== null) {
      return Object.fromEntries(
        Object.keys(v)
          .filter((k) => (v as Record<string, unknown>)[k] !== undefined && (v as Record<string, unknown>)[k] !== null)
          .sort()
          .map((k) => [k, norm((v as Record<string, unknown>)[k])]),
      );
    }
    return v;
  };
  return JSON.stringify(norm(value));
}

const MAX_NAME = 120;
function importedName(name: string, taken: (n: string) => boolean): string {
  for (let n = 1; ; n++) {
    const suffix = n === 1 ? ' (imported)' : ` (imported ${n})`;
    const candidate = `${name.slice(0, MAX_NAME - suffix.length)}${suffix}`;
    if (!taken(candidate)) return candidate;
  }
}

const partKey = (kind: string, name: string): string => `${kind}\u0000${name.trim()}`;
const escape = (s: string): string => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
/** The name itself or a copy an earlier import renamed, "<name> (imported)", "<name> (imported 2)"... */
const family = (name: string): RegExp => new RegExp(`^${escape(name)}( \\(imported( \\d+)?\\))?$`);
/** A part's fields only (the input schema drops the id and the version the store adds). */
const stripPart = (p: PartInput): string => canonical({ ...partInput.parse(p), name: undefined });
const planCanon = (p: Omit<PlanInput, 'engineId'>): string => canonical({ ...p, name: undefined, coilWiring: p.coilWiring ?? 'as-marked-for-earth' });

type EngineSlot = { id: number; canon: string | null; plans: Map<string, string | null> };

/**
 * Walks the file against the store. With `write` false nothing is written (ids of records that
 * would be added are stand-ins); with `write` true each record is created as it is reached.
 */
function walk(repos: Repositories, file: WorkshopFile, write: boolean, tickTimes?: ReturnType<typeof createTickTimes>): ImportSummary {
  const summary: ImportSummary = { added: { parts: 0, engines: 0, plans: 0, readings: 0, ticks: 0 }, skipped: 0, renamed: 0, items: [] };
  let standIn = 0;
  const newId = (): number => --standIn;

  const parts = new Map<string, Array<{ id: number; canon: string }>>();
  for (const p of repos.parts.list()) {
    const k = partKey(p.kind, p.name);
    parts.set(k, [...(parts.get(k) ?? []), { id: p.id, canon: stripPart(p) }]);
  }
  const partIds = new Map<number, number>(); // file id -> store id
  for (const { fileId, part } of file.parts) {
    const k = partKey(part.kind, part.name);
    const canon = stripPart(part);
    const names = family(part.name.trim());
    const same = [...parts.entries()]
      .filter(([key]) => key.startsWith(`${part.kind}\u0000`) && names.test(key.slice(part.kind.length + 1)))
      .flatMap(([, list]) => list)
      .find((s) => s.canon === canon);
    if (same) {
      partIds.set(fileId, same.id);
      summary.skipped++;
      summary.items.push({ record: 'part', kind: part.kind, name: part.name, outcome: 'skipped' });
      continue;
    }
    let toStore = part;
    if (parts.has(k)) {
      const newName = importedName(part.name.trim(), (n) => parts.has(partKey(part.kind, n)));
      toStore = { ...part, name: newName };
      summary.renamed++;
      summary.items.push({ record: 'part', kind: part.kind, name: part.name, outcome: 'renamed', newName });
    } else summary.items.push({ record: 'part', kind: part.kind, name: part.name, outcome: 'added' });
    const id = write ? repos.parts.create(toStore).id : newId();
    summary.added.parts++;
    partIds.set(fileId, id);
    const nk = partKey(toStore.kind, toStore.name);
    parts.set(nk, [...(parts.get(nk) ?? []), { id, canon: stripPart(toStore) }]);
  }
  const mapPart = (id: number | null | undefined): number | null => {
    if (id === null || id === undefined) return null;
    const mapped = partIds.get(id);
    if (mapped === undefined) throw new StoreError('INVALID_INPUT', `No part in the file has the id ${id}.`);
    return mapped;
  };

  const engines = new Map<string, EngineSlot>();
  for (const s of repos.engines.list()) {
    let canon: string | null = null;
    try {
      canon = canonical({ ...engineInput.parse(repos.engines.get(s.id)), name: undefined });
    } catch {
      canon = null; // an unreadable engine never matches; its name is still taken
    }
    const plans = new Map<string, string | null>();
    for (const p of repos.plans.list(s.id)) {
      const { engineId: _e, ...rest } = planInput.parse(p);
      plans.set(p.name.trim(), planCanon(rest));
    }
    engines.set(s.name.trim(), { id: s.id, canon, plans });
  }

  for (const { engine, plans } of file.engines) {
    const existing = { ...engine.existing };
    for (const [key] of PART_REFS_ENGINE) (existing as Record<string, unknown>)[key] = mapPart(engine.existing[key] as number | null);
    const mapped: EngineInput = { ...engine, existing };
    const canon = canonical({ ...mapped, name: undefined });
    const name = engine.name.trim();
    const names = family(name);
    const match = [...engines.entries()].find(([n, e]) => names.test(n) && e.canon === canon);
    let slot: EngineSlot;
    let engineName = match?.[0] ?? name;
    if (match) {
      slot = match[1];
      summary.skipped++;
      summary.items.push({ record: 'engine', name, outcome: 'skipped' });
    } else {
      if (engines.has(name)) {
        engineName = importedName(name, (n) => engines.has(n));
        summary.renamed++;
        summary.items.push({ record: 'engine', name, outcome: 'renamed', newName: engineName });
      } else summary.items.push({ record: 'engine', name, outcome: 'added' });
      const id = write ? repos.engines.create({ ...mapped, name: engineName }).id : newId();
      summary.added.engines++;
      slot = { id, canon, plans: new Map() };
      engines.set(engineName, slot);
    }

    for (const { plan, readings, ticks } of plans) {
      const withParts = { ...plan };
      for (const [key] of PART_REFS_PLAN) if (key !== 'engineId') (withParts as Record<string, unknown>)[key] = mapPart(plan[key as keyof typeof plan] as number | null);
      const pc = planCanon(withParts);
      const planName = plan.name.trim();
      const planNames = family(planName);
      if ([...slot.plans.entries()].some(([n, c]) => planNames.test(n) && c === pc)) {
        summary.skipped++;
        summary.items.push({ record: 'plan', engine: engineName, name: planName, outcome: 'skipped' });
        continue;
      }
      let finalName = planName;
      if (slot.plans.has(planName)) {
        finalName = importedName(planName, (n) => slot.plans.has(n));
        summary.renamed++;
        summary.items.push({ record: 'plan', engine: engineName, name: planName, outcome: 'renamed', newName: finalName });
      } else summary.items.push({ record: 'plan', engine: engineName, name: planName, outcome: 'added' });
      summary.added.plans++;
      summary.added.readings += readings.length;
      summary.added.ticks += ticks.length;
      slot.plans.set(finalName, planCanon({ ...withParts, name: finalName }));
      if (write) {
        const created = repos.plans.create({ ...withParts, name: finalName, engineId: slot.id } as PlanInput);
        for (const r of readings) repos.readings.add({ ...r, planId: created.id });
        for (const t of ticks) {
          repos.ticks.set(created.id, t.stepKey, true);
          tickTimes?.setTime(created.id, t.stepKey, t.tickedOn);
        }
      }
    }
  }
  return summary;
}

export function previewImport(repos: Repositories, file: WorkshopFile): ImportSummary {
  return walk(repos, file, false);
}

/** Writes the file's records in one transaction; returns what was done (the same as the preview). */
export function applyImport(repos: Repositories, file: WorkshopFile, tickTimes?: ReturnType<typeof createTickTimes>): ImportSummary {
  return repos.transaction(() => walk(repos, file, true, tickTimes));
}
