/** A verdict shown three ways at once: our word, the spark-gap mark (sheet/Marks.tsx) and a colour. */
import type { ReactNode } from 'react';
import type { VerdictValue } from '../../../electron/ipc/channels.js';
import { VerdictMark } from '../../sheet/Marks.js';
import { verdictWords } from './words.js';

export function VerdictBadge({ verdict, large, testId }: { verdict: VerdictValue; large?: boolean; testId?: string }): ReactNode {
  return (
    <span className={`verdict verdict-${verdict}${large ? ' large' : ''}`} data-verdict={verdict} data-testid={testId}>
      <VerdictMark verdict={verdict} size={large ? 32 : 22} />
      <span className="verdict-word">{verdictWords[verdict]}</span>
    </span>
  );
}

/** What each mark says, in the trade's terms. */
const meaning: Record<VerdictValue, string> = {
  pass: 'the spark jumps the gap with room to spare; nothing to change.',
  caution: 'it barely jumps, or a part runs near its limit; read what to do.',
  fail: 'no spark where one is needed, or a part is harmed; do not fit it like this.',
};

/** The key to the three marks, beside the cards, so the marks read on paper and in grey too. */
export function VerdictKey(): ReactNode {
  return (
    <ul className="verdict-key" aria-label="How to read the verdict marks" data-testid="verdict-key">
      {(['pass', 'caution', 'fail'] as const).map((v) => (
        <li key={v}>
          <VerdictBadge verdict={v} /> <span className="verdict-meaning">{meaning[v]}</span>
        </li>
      ))}
    </ul>
  );
}
