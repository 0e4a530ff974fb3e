/** "Records and backups": what was deleted lately, backups and restore, the whole workshop as one file, the parts lists as CSV. */
import type { ReactNode } from 'react';
import { BackupsSection } from './BackupsSection.js';
import { PartsCsvSection } from './PartsCsvSection.js';
import { RemovedSection } from './RemovedSection.js';
import { WorkshopFileSection } from './WorkshopFileSection.js';

/** `version`: the app's data version; the recently removed list reads again when it moves. */
export function RecordsScreen({ onChanged, version }: { onChanged: () => void; version: number }): ReactNode {
  return (
    <section className="screen" aria-labelledby="records-title">
      <div className="screen-head">
        <h1 id="records-title" tabIndex={-1}>
          Records and backups
        </h1>
      </div>
      <RemovedSection onRestored={onChanged} version={version} />
      <BackupsSection onRestored={onChanged} />
      <WorkshopFileSection onImported={onChanged} />
      <PartsCsvSection onImported={onChanged} />
    </section>
  );
}
