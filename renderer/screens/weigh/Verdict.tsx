/** A verdict shown three ways at once: our word, an icon shape (tick, triangle, cross) and a colour. */
import type { ReactNode } from 'react';
import type { VerdictValue } from '../../../electron/ipc/channels.js';
import { verdictIcons, verdictWords } from './words.js';

export function VerdictBadge({ verdict, large, testId }: { verdict: VerdictValue; large?: boolean; testId?: string }): ReactNode {
  return (
    <span className={`verdict verdict-${verdict}${large ? ' large' : ''}`} data-verdict={verdict} data-testid={testId}>
      <span className={`verdict-icon shape-${verdict}`} aria-hidden="true">
        {verdictIcons[verdict]}
      </span>
      <span className="verdict-word">{verdictWords[verdict]}</span>
    </span>
  );
}
