/** "Load the demo workshop": adds the invented demo engines and parts after asking first. */
import { useState, type ReactNode } from 'react';
import { call } from './bridge.js';
import { Confirm } from './Dialog.js';

const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

export function DemoLoader({ onLoaded, onProblem }: { onLoaded: (summary: string) => void; onProblem: (message: string) => void }): ReactNode {
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const load = async (): Promise<void> => {
    setBusy(true);
    const r = await call('demo.load', {});
    setBusy(false);
    setAsking(false);
    if (!r.ok) return onProblem(r.error.message);
    const { enginesAdded, partsAdded, plansAdded } = r.value;
    onLoaded(
      enginesAdded + partsAdded + plansAdded === 0
        ? 'The demo workshop is already here; nothing was added.'
        : `Added ${plural(enginesAdded, 'engine', 'engines')}, ${plural(partsAdded, 'part', 'parts')} and ${plural(plansAdded, 'plan', 'plans')} from the demo workshop.`,
    );
  };
  return (
    <>
      <button type="button" onClick={() => setAsking(true)}>
        Load the demo workshop
      </button>
      {asking ? (
        <Confirm
          title="Load the demo workshop?"
          confirmLabel="Load the demo"
          cancelLabel="Not now"
          busy={busy}
          onConfirm={() => void load()}
          onCancel={() => setAsking(false)}
          testId="demo-dialog"
        >
          <p>This adds a few invented engines, parts and plans to look around with. They sit beside your own records, which are not changed.</p>
        </Confirm>
      ) : null}
    </>
  );
}
