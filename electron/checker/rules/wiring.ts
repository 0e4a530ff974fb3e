/**
 * Wiring rules: the condenser, suppressed leads, and whether the setup is complete at all.
 */
import type { LeadsSpec } from '../types.js';
import { fig, isModuleKind, result, type FailTest, type Rule } from './context.js';

export const condenser: Rule = (ctx) => {
  const { setup, p } = ctx;
  const id = 'condenser';
  const title = 'Condenser';
  const uf = p.condenserF * 1e6;
  const figures = [fig('condenser', uf, 'uF')];
  if (p.kind === 'points' || p.kind === 'magneto') {
    const why = 'The condenser across the points stops them arcing as they open; without it they burn in hours and the spark is weak.';
    if (setup.condenserF === null) return result(id, title, 'fail', figures, why, 'Fit a condenser across the points (about 0.2 uF).', ['condenser:fit']);
    // Typical points condensers are 0.18 to 0.25 uF (from memory); allow some spread.
    if (uf < 0.12 || uf > 0.4) return result(id, title, 'caution', figures, `${why} This one is outside the usual 0.18 to 0.25 uF.`, 'Fit a condenser of about 0.2 uF.');
    return result(id, title, 'pass', figures, why, 'Nothing to do.');
  }
  const why = 'A module switches the coil itself; a condenser left across the coil negative slows the rise (its charge reflects into the secondary as C/n^2) and can upset the module.';
  if (setup.condenserF !== null) {
    return result(id, title, p.kind === 'capacitive-discharge' ? 'fail' : 'caution', figures, p.kind === 'capacitive-discharge' ? 'A condenser across a CD coil primary swallows the discharge pulse.' : why, 'Disconnect the condenser lead from the coil negative (or remove the condenser).', ['condenser:remove']);
  }
  return result(id, title, 'pass', figures, why, 'Make sure the old condenser is disconnected from the coil negative.');
};

/** Points without a condenser, or a condenser left across a CD coil primary. */
export const condenserFails: FailTest = ({ p, setup }) =>
  p.kind === 'points' || p.kind === 'magneto' ? setup.condenserF === null : setup.condenserF !== null && p.kind === 'capacitive-discharge';

/** Resistive or spiral core, or at least 1 kohm a lead (common practice). */
const isSuppressed = (leads: LeadsSpec): boolean => leads.core !== 'copper' || leads.resistancePerLeadOhm >= 1000;

export const suppressedLeads: Rule = (ctx) => {
  const { setup } = ctx;
  const id = 'suppressed-leads';
  const title = 'Suppressed leads';
  const m = setup.module;
  const leads = setup.leads;
  const plugR = setup.plug?.resistor === true;
  const figures = leads ? [fig('lead resistance', leads.resistancePerLeadOhm, 'ohm')] : [];
  if (!isModuleKind(ctx) || !m || !m.needsSuppressedLeads) return result(id, title, 'pass', figures, 'The module does not call for suppressed leads.', 'Nothing to do.');
  const why = 'Spark interference can trigger the module falsely or damage it; this module needs suppressed (resistive or spiral) leads or resistor plugs.';
  if (!leads) return result(id, title, plugR ? 'pass' : 'caution', figures, why, plugR ? 'Resistor plugs are fitted; that is enough.' : 'Record the leads fitted; use suppressed leads or resistor plugs.');
  if (!isSuppressed(leads) && !plugR) return result(id, title, 'fail', figures, why, 'Fit suppressed leads or resistor plugs before running the engine with this module.');
  return result(id, title, 'pass', figures, why, 'Nothing to do.');
};

/** A module that needs suppression, plain copper leads recorded and no resistor plugs. */
export const suppressedLeadsFails: FailTest = (ctx) => {
  const { setup } = ctx;
  const m = setup.module;
  if (!isModuleKind(ctx) || !m || !m.needsSuppressedLeads || !setup.leads) return false;
  return !isSuppressed(setup.leads) && setup.plug?.resistor !== true;
};

export const setupComplete: Rule = (ctx) => {
  const { p } = ctx;
  if (p.issues.length === 0) return result('setup-complete', 'Setup complete', 'pass', [], 'Every part the setup needs is described.', 'Nothing to do.');
  return result('setup-complete', 'Setup complete', 'fail', [], `The setup cannot be checked properly: ${p.issues.join(' ')}`, 'Complete the missing part details; the figures below use the stated assumptions.');
};

export const setupCompleteFails: FailTest = (ctx) => ctx.p.issues.length !== 0;
