/** A screen that is planned but not built yet: it says so plainly and shows nothing invented. */
import type { ReactNode } from 'react';

export function LaterScreen({ title, what }: { title: string; what: string }): ReactNode {
  return (
    <section className="screen" aria-labelledby="later-title">
      <h1 id="later-title">{title}</h1>
      <div className="later" data-testid="later-release">
        <p>
          <strong>This screen arrives with a later release.</strong> Nothing here yet.
        </p>
        <p>{what}</p>
      </div>
    </section>
  );
}

export const laterText = {
  parts: 'It will list the coils, ballast resistors, modules, rev counters, HT leads and plugs you have, with their measured and catalogue values. The engine editor already offers the parts that are in your workshop.',
  combination: 'It will weigh a module, coil and ballast against the ignition fitted now: spark energy, available voltage, coil current and heat across the rev range, each figure with its limit and what to do about it.',
  sheet: 'It will print the wiring checklist for a chosen combination: the steps in order, the readings to expect at each terminal, and the cautions, on an A4 or Letter page in black and white.',
} as const;
