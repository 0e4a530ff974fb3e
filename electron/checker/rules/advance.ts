/**
 * The engine's total advance: static timing plus the most the distributor's curve adds. Road
 * engines of the period run some 30 to 45 crank degrees in all at full advance; nothing uses more
 * than about 60 (from memory). A total beyond that is almost always a curve typed in distributor
 * degrees (half the crank figure) doubled twice, or static and total swapped, and it puts the spark
 * where the required voltage and the cylinder state the checker works out are meaningless.
 */
import { fig, fmt, result, type FailTest, type Rule, type RuleContext } from './context.js';

/** Total advance (static + curve maximum) beyond which no engine runs, in crank degrees (from memory). */
export const TOTAL_ADVANCE_MAX_DEG = 60;

/** Static timing plus the largest advance of the curve (0 if the curve is empty or only retards). */
export function totalAdvanceDeg(ctx: RuleContext): number {
  let most = 0;
  for (const row of ctx.engine.advanceCurve) if (row.advanceDeg > most) most = row.advanceDeg;
  return ctx.engine.staticTimingDegBtdc + most;
}

export const totalAdvance: Rule = (ctx) => {
  const id = 'total-advance';
  const title = 'Total advance';
  const total = totalAdvanceDeg(ctx);
  const figures = [fig('static timing', ctx.engine.staticTimingDegBtdc, 'deg BTDC'), fig('total at full advance', total, 'deg BTDC'), fig('most any engine uses (from memory)', TOTAL_ADVANCE_MAX_DEG, 'deg')];
  const why = 'The spark timing sets the cylinder pressure at the spark, and so the voltage the plug needs.';
  if (total > TOTAL_ADVANCE_MAX_DEG) {
    return result(id, title, 'caution', figures, `${why} Static timing plus the advance curve come to ${fmt(total, 0)} crank degrees, more than any engine uses, so the figures below are unreliable.`, 'Check the advance curve against the service data: enter crank degrees (twice the distributor figure) added to the static timing, not the total.');
  }
  return result(id, title, 'pass', figures, `${why} Static timing plus the advance curve come to ${fmt(total, 0)} crank degrees.`, 'Nothing to do.');
};

/** A caution at most: the engine's own data, which no choice of parts can fail. */
export const totalAdvanceFails: FailTest = () => false;
