/** The whole workshop as one file: make it (to save or copy), or bring one in after a preview. */
import { useState, type ReactNode } from 'react';
import { call } from '../../app/bridge.js';
import { Notice } from '../../app/Notice.js';
import { FileOut } from './FileOut.js';
import { ImportPreview, ProblemList } from './ImportPreview.js';
import { useFileImport } from './use-file-import.js';

export function WorkshopFileSection({ onImported }: { onImported: () => void }): ReactNode {
  const [out, setOut] = useState<{ text: string; fileName: string; note: string } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const imp = useFileImport(
    (text) => call('workshop.importPreview', { text }),
    async (text) => {
      const r = await call('workshop.import', { text });
      if (r.ok) onImported();
      return r;
    },
  );

  async function make(): Promise<void> {
    const r = await call('workshop.export', {});
    if (!r.ok) return setProblem(r.error.message);
    const c = r.value.counts;
    const skipped = r.value.unreadable.length > 0 ? ` ${r.value.unreadable.length} unreadable row(s) were left out: ${r.value.unreadable.join(' ')}` : '';
    setOut({ text: r.value.text, fileName: r.value.fileName, note: `${c.engines} engines, ${c.parts} parts, ${c.plans} plans, ${c.readings} readings.${skipped}` });
  }

  return (
    <section aria-labelledby="workshop-file-title" className="records-part">
      <h2 id="workshop-file-title">The whole workshop as one file</h2>
      <p>
        <button type="button" onClick={() => void make()}>
          Make the workshop file
        </button>
      </p>
      {problem ? <Notice kind="problem">{problem}</Notice> : null}
      {out ? (
        <>
          <p>{out.note}</p>
          <FileOut text={out.text} fileName={out.fileName} mime="application/json" label="Workshop file (JSON)" testId="workshop-file-out" />
        </>
      ) : null}
      <label className="file-in">
        Bring in a workshop file
        <input type="file" accept=".json,application/json" data-testid="workshop-file-in" onChange={(e) => void imp.choose(e.currentTarget.files?.[0])} />
      </label>
      <ImportSteps imp={imp} what="workshop file" testId="workshop-import" />
    </section>
  );
}

/** Shared by the workshop file and the parts CSV: the preview with its confirm, the refusal, the result. */
export function ImportSteps({ imp, what, testId }: { imp: ReturnType<typeof useFileImport>; what: string; testId: string }): ReactNode {
  const s = imp.step;
  if (s.at === 'busy') return <p role="status">Reading the {what}…</p>;
  if (s.at === 'refused') return <ProblemList message={s.error.message} fields={s.error.fields} testId={`${testId}-problems`} />;
  if (s.at === 'preview') {
    return (
      <div className="import-preview">
        <h3>What the import will do</h3>
        <ImportPreview summary={s.summary} testId={`${testId}-preview`} />
        <p>
          <button type="button" className="primary" onClick={() => void imp.confirm()}>
            Import
          </button>{' '}
          <button type="button" onClick={imp.reset}>
            Cancel
          </button>
        </p>
      </div>
    );
  }
  if (s.at === 'done') {
    return (
      <Notice kind="done" onDismiss={imp.reset} testId={`${testId}-done`}>
        Imported: {s.summary.added.parts} parts, {s.summary.added.engines} engines, {s.summary.added.plans} plans added; {s.summary.skipped} already here.
      </Notice>
    );
  }
  return null;
}
