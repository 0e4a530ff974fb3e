/**
 * The checks, rule by rule: first an overview with every setup side by side, then for each setup
 * what each check found, with its figures, why it matters and what to do. Checks that need
 * attention are open; the ones that came out fine are folded away but one click off.
 */
import { memo, type ReactNode } from 'react';
import type { ShownRule, ShownSetup } from '../../../electron/ipc/channels.js';
import { useGapUnit } from '../../app/units.js';
import { VerdictBadge } from './Verdict.js';
import { figureName, figureText } from './words.js';

const setupName = (s: ShownSetup): string => (s.kind === 'existing' ? 'Fitted now' : s.name);
const rank = { fail: 0, caution: 1, pass: 2 } as const;

export const RuleOverview = memo(function RuleOverview({ setups }: { setups: readonly ShownSetup[] }): ReactNode {
  const first = setups[0];
  if (!first) return null;
  return (
    <table className="list rule-overview" aria-label="Every check, setups side by side" data-testid="rule-overview">
      <thead>
        <tr>
          <th scope="col">Check</th>
          {setups.map((s, i) => (
            <th scope="col" key={i}>
              {setupName(s)}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {first.rules.map((r) => (
          <tr key={r.id}>
            <th scope="row">{r.title}</th>
            {setups.map((s, i) => {
              const mine = s.rules.find((x) => x.id === r.id);
              return <td key={i}>{mine ? <VerdictBadge verdict={mine.verdict} /> : '—'}</td>;
            })}
          </tr>
        ))}
      </tbody>
    </table>
  );
});

function RuleItem({ rule, testId, printCopy }: { rule: ShownRule; testId?: string; printCopy?: boolean }): ReactNode {
  const [unit] = useGapUnit();
  return (
    <li className={`${printCopy ? 'rule-copy' : 'rule'} rule-${rule.verdict}`} data-testid={testId} data-rule={printCopy ? undefined : rule.id}>
      <div className="rule-head">
        <VerdictBadge verdict={rule.verdict} />
        <h4>{rule.title}</h4>
      </div>
      {rule.figures.length > 0 ? (
        <ul className="figures">
          {rule.figures.map((f, i) => (
            <li key={i}>
              <span className="figure-name">{figureName(f.name, f.unit)}</span> <span className="figure-value">{figureText(f.value, f.unit, unit)}</span>
              {f.measured ? <span className="measured-tag">measured</span> : null}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="rule-why">
        <strong>Why it matters:</strong> {rule.why}
      </p>
      <p className="rule-action">
        <strong>What to do:</strong> {rule.action}
      </p>
    </li>
  );
}

export const RuleDetails = memo(function RuleDetails({ setup, index }: { setup: ShownSetup; index: number }): ReactNode {
  const sorted = [...setup.rules].sort((a, b) => rank[a.verdict] - rank[b.verdict]);
  const attention = sorted.filter((r) => r.verdict !== 'pass');
  const fine = sorted.filter((r) => r.verdict === 'pass');
  const titleId = `rules-title-${index}`;
  return (
    <section className="panel rule-details" aria-labelledby={titleId} data-testid={`rules-${index}`}>
      <h3 id={titleId}>What the checks say about {setup.kind === 'existing' ? 'the ignition fitted now' : `“${setup.name}”`}</h3>
      {attention.length > 0 ? (
        <ul className="rules">
          {attention.map((r) => (
            <RuleItem key={r.id} rule={r} testId={`rule-${index}-${r.id}`} />
          ))}
        </ul>
      ) : (
        <p>Every check came out fine.</p>
      )}
      {fine.length > 0 ? (
        <details className="fine-rules">
          <summary>
            {fine.length} {fine.length === 1 ? 'check' : 'checks'} came out fine: show {fine.length === 1 ? 'it' : 'them'}
          </summary>
          <ul className="rules">
            {fine.map((r) => (
              <RuleItem key={r.id} rule={r} testId={`rule-${index}-${r.id}`} />
            ))}
          </ul>
        </details>
      ) : null}
      {/* CSS cannot open a <details> for the print: the print gets its own copy, never folded. */}
      {fine.length > 0 ? (
        <div className="print-copy" aria-hidden="true">
          <p className="print-copy-head">
            {fine.length} {fine.length === 1 ? 'check' : 'checks'} came out fine:
          </p>
          <ul className="rules">
            {fine.map((r) => (
              <RuleItem key={r.id} rule={r} printCopy />
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
});
