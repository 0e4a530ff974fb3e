/**
 * Backups: make one now, the list (date, why it was made, engines / parts / plans in it), and a
 * restore that asks first and says a backup of the current workshop is made before it.
 */
import { useCallback, useEffect, useState, type ReactNode } from 'react';
import type { BackupInfoView } from '../../../electron/ipc/channels.js';
import { call } from '../../app/bridge.js';
import { Confirm } from '../../app/Dialog.js';
import { Notice } from '../../app/Notice.js';

const reasonWords: Record<BackupInfoView['reason'], string> = {
  manual: 'made by hand',
  daily: 'daily',
  'before-migration': 'before an update of the file',
  'before-restore': 'before a restore',
  'before-import': 'before an import',
};

const when = (iso: string): string => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

export function BackupsSection({ onRestored }: { onRestored: () => void }): ReactNode {
  const [list, setList] = useState<BackupInfoView[] | null>(null);
  const [keep, setKeep] = useState<string>('');
  const [message, setMessage] = useState<{ kind: 'done' | 'problem'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const [asking, setAsking] = useState<BackupInfoView | null>(null);

  const load = useCallback(async () => {
    const r = await call('backup.list', {});
    if (r.ok) {
      setList(r.value.backups);
      setKeep(`The newest ${r.value.keepLast}${r.value.keepMonthly ? ' and the newest of each month' : ''} are kept, in ${r.value.folder}.`);
    } else setMessage({ kind: 'problem', text: r.error.message });
  }, []);
  useEffect(() => {
    void load();
  }, [load]);

  async function backUpNow(): Promise<void> {
    setBusy(true);
    const r = await call('backup.create', {});
    setBusy(false);
    setMessage(r.ok ? { kind: 'done', text: `Backed up: ${when(r.value.createdAt)}.` } : { kind: 'problem', text: r.error.message });
    await load();
  }

  async function restore(b: BackupInfoView): Promise<void> {
    setBusy(true);
    const r = await call('backup.restore', { name: b.name, confirmed: true });
    setBusy(false);
    setAsking(null);
    if (r.ok) {
      setMessage({ kind: 'done', text: `The workshop is back as it was on ${when(b.createdAt)}. What it held just before is kept as a backup of ${when(r.value.safetyBackup.createdAt)}.` });
      onRestored();
    } else setMessage({ kind: 'problem', text: r.error.message });
    await load();
  }

  return (
    <section aria-labelledby="backups-title" className="records-part">
      <h2 id="backups-title">Backups</h2>
      <p>
        <button type="button" className="primary" onClick={() => void backUpNow()} disabled={busy}>
          Back up now
        </button>
      </p>
      {message ? (
        <Notice kind={message.kind} onDismiss={() => setMessage(null)} testId="backup-message">
          {message.text}
        </Notice>
      ) : null}
      <p className="quiet">A backup is also made once a day when the app first opens, and before the file is updated by a new version. {keep}</p>
      {list === null ? (
        <p>Reading the backups…</p>
      ) : list.length === 0 ? (
        <p className="empty">No backups yet.</p>
      ) : (
        <table className="list" aria-label="Backups" data-testid="backup-list">
          <thead>
            <tr>
              <th scope="col">Made</th>
              <th scope="col">Why</th>
              <th scope="col" className="num">Engines</th>
              <th scope="col" className="num">Parts</th>
              <th scope="col" className="num">Plans</th>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {list.map((b) => (
              <tr key={b.name} data-backup={b.name}>
                <td>{when(b.createdAt)}</td>
                <td>{reasonWords[b.reason]}</td>
                {b.counts ? (
                  <>
                    <td className="num">{b.counts.engines}</td>
                    <td className="num">{b.counts.parts}</td>
                    <td className="num">{b.counts.plans}</td>
                  </>
                ) : (
                  <td colSpan={3}>{b.problem ?? 'Cannot be read.'}</td>
                )}
                <td>
                  <button type="button" className="small" disabled={busy || !b.counts} onClick={() => setAsking(b)} aria-label={`Restore the backup made ${when(b.createdAt)}`}>
                    Restore…
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {asking ? (
        <Confirm
          title="Restore this backup?"
          confirmLabel="Restore it"
          danger
          busy={busy}
          onConfirm={() => void restore(asking)}
          onCancel={() => setAsking(null)}
          testId="restore-question"
        >
          <p>
            The whole workshop is replaced by the backup made {when(asking.createdAt)} ({asking.counts?.engines ?? 0} engines, {asking.counts?.parts ?? 0} parts,{' '}
            {asking.counts?.plans ?? 0} plans). A backup of the workshop as it is now is made first, so this can be undone by restoring that one.
          </p>
        </Confirm>
      ) : null}
    </section>
  );
}
