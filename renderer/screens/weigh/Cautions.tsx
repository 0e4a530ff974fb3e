/** The cautions that go with any report telling someone what to do to an ignition system. */
import type { ReactNode } from 'react';

export function Cautions({ cautions }: { cautions: ReadonlyArray<{ id: string; text: string }> }): ReactNode {
  if (cautions.length === 0) return null;
  return (
    <aside className="cautions" aria-labelledby="cautions-title" data-testid="cautions">
      <h2 id="cautions-title">
        <span className="caution-icon" aria-hidden="true">
          !
        </span>{' '}
        Before you touch the wiring
      </h2>
      <ul>
        {cautions.map((c) => (
          <li key={c.id}>{c.text}</li>
        ))}
      </ul>
    </aside>
  );
}
