/** The sheet's header: the engine, the plan in words, the checker's verdict in one line, today's setup. */
import type { SetupReport, SetupSpec, Verdict } from '../checker/types.js';
import type { SheetContext } from './context.js';
import type { SheetHeader } from './types.js';
import { num, switchingWords, tachSensesWords } from './words.js';

export function verdictLine(report: SetupReport): { verdict: Verdict; line: string } {
  const count = (v: Verdict): number => report.rules.filter((r) => r.verdict === v).length;
  const worst = `worst reserve ratio ${num(report.worstReserveRatio)} at ${num(report.worstReserveRpm, 0)} rpm`;
  return {
    verdict: report.verdict,
    line: `${count('pass')} checks fine, ${count('caution')} to take care over, ${count('fail')} not like this; ${worst}.`,
  };
}

/** A setup's switching in words: "Points kept" for a points plan, else the kind and the module's name. */
export function switchingLine(s: SetupSpec, isPlan: boolean): string {
  if (s.switching === 'points') return isPlan ? 'Points kept' : 'Points';
  if (s.switching === 'magneto') return 'Magneto';
  return `${switchingWords(s.switching)}: ${s.module?.name ?? 'module not chosen'}`;
}

function coilLine(s: SetupSpec): string {
  return `${s.coil.name} (${num(s.coil.primaryResistanceOhm20C.value)} ohm primary at 20 degC)`;
}

function ballastLine(s: SetupSpec): string {
  return s.ballast ? `${s.ballast.name} (${num(s.ballast.coldResistanceOhm.value)} ohm cold)` : 'None';
}

export function existingLine(s: SetupSpec): string {
  const parts = [switchingLine(s, false), coilLine(s)];
  if (s.ballast) parts.push(ballastLine(s));
  if (s.ballast && s.crankingBypass) parts.push('cranking bypass');
  if (s.condenserF !== null) parts.push(`condenser ${num(s.condenserF * 1e6)} uF`);
  if (s.tach) parts.push(s.tach.name);
  if (s.leads) parts.push(s.leads.name);
  if (s.plug) parts.push(`${s.plug.name} at ${num(s.plugGapM * 1000)} mm`);
  return parts.join('; ');
}

export function buildHeader(ctx: SheetContext): SheetHeader {
  const { engine, setup, input } = ctx;
  const suggested = ctx.report.gap?.suggestedGapM;
  let moduleFeed = '';
  if (ctx.module) moduleFeed = ctx.moduleAfterBallast ? 'Module fed after the ballast (15a)' : 'Module fed from terminal 15';
  return {
    engine: {
      name: engine.name,
      yearText: input.about.yearText,
      modelText: input.about.modelText,
      cylinders: engine.cylinders,
      systemVoltageV: engine.systemVoltageV,
      earthPolarity: engine.earthPolarity,
      charging: input.about.charging,
      firingOrder: input.about.firingOrder,
    },
    plan: {
      name: input.plan.name,
      status: input.plan.status,
      switching: switchingLine(setup, true),
      coil: coilLine(setup),
      ballast: ballastLine(setup),
      crankingBypass: ctx.bypass,
      moduleFeed,
      tach: setup.tach ? `${setup.tach.name} (${tachSensesWords(setup.tach.senses)})` : 'None',
      leads: setup.leads ? setup.leads.name : 'Not recorded',
      plug: setup.plug ? setup.plug.name : 'Not recorded',
      plugGapMm: setup.plugGapM * 1000,
      suggestedGapMm: typeof suggested === 'number' && Number.isFinite(suggested) ? suggested * 1000 : null,
    },
    verdict: verdictLine(ctx.report),
    existingLine: existingLine(ctx.existing),
    printedOn: input.printedOn,
  };
}
