/** The parts of one kind as CSV (units in the column headers): make it, or bring one in after a preview. */
import { useState, type ReactNode } from 'react';
import { partKinds, type PartKind } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { Notice } from '../../app/Notice.js';
import { FileOut } from './FileOut.js';
import { useFileImport } from './use-file-import.js';
import { ImportSteps } from './WorkshopFileSection.js';

const kindWords: Record<PartKind, string> = { coil: 'Coils', ballast: 'Ballast resistors', module: 'Modules', tach: 'Tachometers', leads: 'HT leads', plug: 'Plugs' };

export function PartsCsvSection({ onImported }: { onImported: () => void }): ReactNode {
  const [kind, setKind] = useState<PartKind>('coil');
  const [out, setOut] = useState<{ text: string; fileName: string; count: number } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const imp = useFileImport(
    (text) => call('parts.csvImportPreview', { kind, text }),
    async (text) => {
      const r = await call('parts.csvImport', { kind, text });
      if (r.ok) onImported();
      return r;
    },
  );

  async function make(): Promise<void> {
    const r = await call('parts.csvExport', { kind });
    if (!r.ok) return setProblem(r.error.message);
    setOut({ text: r.value.csv, fileName: r.value.fileName, count: r.value.count });
  }

  return (
    <section aria-labelledby="parts-csv-title" className="records-part">
      <h2 id="parts-csv-title">Parts lists as CSV</h2>
      <label>
        Kind of part{' '}
        <select
          value={kind}
          data-testid="csv-kind"
          onChange={(e) => {
            setKind(e.currentTarget.value as PartKind);
            setOut(null);
            imp.reset();
          }}
        >
          {partKinds.map((k) => (
            <option key={k} value={k}>
              {kindWords[k]}
            </option>
          ))}
        </select>
      </label>{' '}
      <button type="button" onClick={() => void make()}>
        Make the CSV
      </button>
      {problem ? <Notice kind="problem">{problem}</Notice> : null}
      {out ? <FileOut text={out.text} fileName={out.fileName} mime="text/csv" label={`${kindWords[kind]} (${out.count}) as CSV`} testId="csv-out" /> : null}
      <label className="file-in">
        Bring in a CSV of {kindWords[kind].toLowerCase()}
        <input type="file" accept=".csv,text/csv" data-testid="csv-in" onChange={(e) => void imp.choose(e.currentTarget.files?.[0])} />
      </label>
      <p className="quiet">All or nothing: a file with any problem is refused whole, each problem named by its row and column.</p>
      <ImportSteps imp={imp} what="CSV" testId="csv-import" />
    </section>
  );
}
