/** "Records and backups": backups and restore, the whole workshop as one file, the parts lists as CSV. */
import type { ReactNode } from 'react';
import { BackupsSection } from './BackupsSection.js';
import { PartsCsvSection } from './PartsCsvSection.js';
import { WorkshopFileSection } from './WorkshopFileSection.js';

export function RecordsScreen({ onChanged }: { onChanged: () => void }): ReactNode {
  return (
    <section className="screen" aria-labelledby="records-title">
      <div className="screen-head">
        <h1 id="records-title" tabIndex={-1}>
          Records and backups
        </h1>
      </div>
      <BackupsSection onRestored={onChanged} />
      <WorkshopFileSection onImported={onChanged} />
      <PartsCsvSection onImported={onChanged} />
    </section>
  );
}
