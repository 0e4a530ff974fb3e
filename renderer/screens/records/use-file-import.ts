/**
 * The steps of bringing a file in: read the chosen file, ask the store for a preview, then (after
 * the person confirms) the import itself. A refused file keeps its whole problem list; nothing is
 * written until the confirmation.
 */
import { useState } from 'react';
import type { AppError, ImportSummaryView, Result } from '../../../electron/ipc/channels.js';

export type ImportStep =
  | { at: 'idle' }
  | { at: 'busy' }
  | { at: 'preview'; text: string; summary: ImportSummaryView }
  | { at: 'refused'; error: AppError }
  | { at: 'done'; summary: ImportSummaryView };

export function useFileImport(preview: (text: string) => Promise<Result<ImportSummaryView>>, commit: (text: string) => Promise<Result<ImportSummaryView>>) {
  const [step, setStep] = useState<ImportStep>({ at: 'idle' });
  return {
    step,
    async choose(file: File | undefined): Promise<void> {
      if (!file) return;
      setStep({ at: 'busy' });
      const text = await file.text();
      const r = await preview(text);
      setStep(r.ok ? { at: 'preview', text, summary: r.value } : { at: 'refused', error: r.error });
    },
    async confirm(): Promise<void> {
      if (step.at !== 'preview') return;
      const text = step.text;
      setStep({ at: 'busy' });
      const r = await commit(text);
      setStep(r.ok ? { at: 'done', summary: r.value } : { at: 'refused', error: r.error });
    },
    reset: () => setStep({ at: 'idle' }),
  };
}
