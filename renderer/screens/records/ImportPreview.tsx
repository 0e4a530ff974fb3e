/** What an import will do (or did): counts, then each record with its outcome in words. */
import type { ReactNode } from 'react';
import type { ImportSummaryView } from '../../../electron/ipc/channels.js';
import { Notice } from '../../app/Notice.js';

const outcomeWords = { added: 'will be added', skipped: 'is already here (skipped)', renamed: 'differs from the one here: added as' } as const;

export function ImportPreview({ summary, testId }: { summary: ImportSummaryView; testId: string }): ReactNode {
  const a = summary.added;
  return (
    <div data-testid={testId}>
      <p>
        To add: {a.parts} part{a.parts === 1 ? '' : 's'}, {a.engines} engine{a.engines === 1 ? '' : 's'}, {a.plans} plan{a.plans === 1 ? '' : 's'}, {a.readings} reading
        {a.readings === 1 ? '' : 's'}. Skipped: {summary.skipped}. Renamed: {summary.renamed}.
      </p>
      <ul className="import-items">
        {summary.items.map((item, i) => (
          <li key={i}>
            {item.record === 'part' ? `Part (${item.kind ?? ''})` : item.record === 'engine' ? 'Engine' : `Plan of ${item.engine ?? ''}`} “{item.name}” {outcomeWords[item.outcome]}
            {item.newName ? ` “${item.newName}”` : ''}
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Every problem of a refused file, one line each, `where: why`. */
export function ProblemList({ message, fields, testId }: { message: string; fields?: Record<string, string> | undefined; testId: string }): ReactNode {
  return (
    <Notice kind="problem" testId={testId}>
      {message}
      {fields && Object.keys(fields).length > 0 ? (
        <ul className="file-problems">
          {Object.entries(fields).map(([where, why]) => (
            <li key={where}>
              <strong>{where}</strong>: {why}
            </li>
          ))}
        </ul>
      ) : null}
    </Notice>
  );
}
