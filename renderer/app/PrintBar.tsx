/**
 * The page size and the Print button, for any screen that prints (the wiring sheet, the weighing). The desktop window prints to a PDF the person saves
 * ('app.print'); the browser host cannot, and answers UNSUPPORTED: then the browser's own print
 * dialogue opens (window.print()), with the sheet's print stylesheet and the chosen page size.
 */
import { useState, type ReactNode } from 'react';
import type { PageSize } from '../sheet/SheetDocument.js';
import { call } from './bridge.js';
import type { NoticeKind } from './Notice.js';

const sizes: readonly PageSize[] = ['A4', 'Letter'];

type Props = {
  /** What is printed, as the start of a sentence: "The sheet", "The comparison". */
  what: string;
  pageSize: PageSize;
  onPageSize: (s: PageSize) => void;
  onResult: (kind: NoticeKind, text: string) => void;
};

export function PrintBar({ what, pageSize, onPageSize, onResult }: Props): ReactNode {
  const [busy, setBusy] = useState(false);
  const print = async (): Promise<void> => {
    setBusy(true);
    const r = await call('app.print', { pageSize });
    setBusy(false);
    if (r.ok) {
      if (r.value.saved && r.value.path) onResult('done', `${what} was saved as ${r.value.path}.`);
      return;
    }
    if (r.error.code === 'UNSUPPORTED') {
      window.print();
      return;
    }
    onResult('problem', `${what} was not printed: ${r.error.message}`);
  };
  return (
    <div className="print-bar">
      <fieldset className="page-size">
        <legend>Paper</legend>
        {sizes.map((s) => (
          <label key={s}>
            <input type="radio" name={`${what}-page-size`} value={s} checked={pageSize === s} onChange={() => onPageSize(s)} /> {s}
          </label>
        ))}
      </fieldset>
      <button type="button" className="primary" onClick={() => void print()} disabled={busy}>
        Print
      </button>
    </div>
  );
}
