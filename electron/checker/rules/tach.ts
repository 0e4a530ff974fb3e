/**
 * Tachometer compatibility (common practice table):
 * senses                 | points | magneto      | inductive module | CD
 * coil supply current    | works  | reads nothing | usually works   | usually not; needs an adaptor
 * coil negative pulses   | works  | works         | works           | needs the module's tach output
 * module tach output     | n/a    | n/a           | works           | works
 * cable from the engine  | works  | works         | works           | works
 * A magneto makes its own primary current: no battery feed runs to it, so there is no supply
 * current to sense; its contact breaker's pulses are there as on points.
 * Pulses per revolution are cylinders / 2 on a four-stroke. A multi-spark module gives several
 * pulses per firing below its multi-spark rpm, so a pulse-counting tach over-reads there.
 */
import { fig, fmt, result, type FailTest, type Rule, type RuleContext } from './context.js';

/** Which column of the table above the setup falls in. */
const systemClass = ({ p }: RuleContext): 'cd' | 'points' | 'inductive' =>
  p.kind === 'capacitive-discharge' ? 'cd' : p.kind === 'points' || p.kind === 'magneto' ? 'points' : 'inductive';

export const tachRule: Rule = (ctx) => {
  const { setup, engine, p } = ctx;
  const id = 'tach';
  const title = 'Tachometer';
  const t = setup.tach;
  const pulsesPerRev = engine.cycle === 'two-stroke' ? engine.cylinders : engine.cylinders / 2;
  const figures = [fig('pulses per revolution', pulsesPerRev, '')];
  if (!t) return result(id, title, 'pass', figures, 'No tachometer is recorded for this engine.', 'Nothing to do.');
  const m = setup.module;
  const cls = systemClass(ctx);
  const tachOut = m?.tachOutput === true;
  const multiBelow = p.cd?.multiSparkBelowRpm ?? null;
  const why = 'A tachometer reads the ignition\'s pulses; a system that changes the pulses can leave it dead, erratic or reading double.';
  if (t.senses === 'cable') return result(id, title, 'pass', figures, 'A cable-driven tachometer does not depend on the ignition.', 'Nothing to do.');
  if (t.senses === 'module-output') {
    if (cls === 'points') return result(id, title, 'fail', figures, 'This tachometer needs a module tach output, and points have none.', 'Keep the module it was fitted for, or change the tachometer.');
    if (!tachOut) return result(id, title, 'fail', figures, 'This tachometer needs a tach output and the module has none.', 'Choose a module with a tach output, or fit a tach adaptor.');
    if (multiBelow !== null) return result(id, title, 'caution', [...figures, fig('multi-spark below', multiBelow, 'rpm')], 'The module\'s tach output should give one pulse per firing; check it does below the multi-spark speed.', 'Compare the reading with a hand-held tachometer at idle.');
    return result(id, title, 'pass', figures, why, 'Connect the tachometer to the module\'s tach output.');
  }
  if (t.senses === 'coil-supply-current' && p.kind === 'magneto') {
    return result(id, title, 'fail', figures, 'A magneto makes its own current: no battery feed runs to its coil, so a current-sensing tachometer has nothing to read.', 'Drive the tachometer by cable, or fit one that counts the contact breaker\'s pulses.');
  }
  if (cls === 'cd') {
    if (t.senses === 'coil-supply-current') return result(id, title, 'fail', figures, 'A capacitive-discharge system does not pass pulsed current through the coil feed, so a current-sensing tachometer reads nothing.', 'Fit a tach adaptor made for capacitive discharge.');
    if (!tachOut) return result(id, title, 'fail', figures, 'The coil negative of a CD system carries pulses of hundreds of volts that a conventional tachometer is not built for.', 'Choose a CD module with a tach output, or fit an adaptor.');
    if (multiBelow !== null) return result(id, title, 'caution', [...figures, fig('multi-spark below', multiBelow, 'rpm')], `Below ${fmt(multiBelow, 0)} rpm the module fires several sparks per event; a pulse-counting tachometer over-reads there.`, 'Connect the tachometer to the module\'s tach output and expect a high reading at idle if it counts every spark.');
    return result(id, title, 'caution', figures, why, 'Move the tachometer lead from the coil negative to the module\'s tach output.');
  }
  if (cls === 'inductive' && t.senses === 'coil-supply-current') {
    return result(id, title, 'caution', figures, 'A current-sensing tachometer usually works with an inductive module, but a module that changes dwell with speed can make it read unsteadily.', 'Check the reading against a hand-held tachometer after the conversion.');
  }
  return result(id, title, 'pass', figures, why, 'Nothing to do: this tachometer reads this system.');
};

/** The table's "needs an adaptor" and "n/a" cells: a tach that reads nothing or is not built for the pulses. */
export const tachFails: FailTest = (ctx) => {
  const t = ctx.setup.tach;
  if (!t || t.senses === 'cable') return false;
  const cls = systemClass(ctx);
  const tachOut = ctx.setup.module?.tachOutput === true;
  if (t.senses === 'module-output') return cls === 'points' || !tachOut;
  if (t.senses === 'coil-supply-current' && ctx.p.kind === 'magneto') return true;
  if (cls === 'cd') return t.senses === 'coil-supply-current' || !tachOut;
  return false;
};
