/** A titled group of fields in an editor (a fieldset whose legend names it). */
import type { ReactNode } from 'react';

export function Group({ title, children, id, full, fieldsClass }: { title: string; children: ReactNode; id: string; full?: boolean; fieldsClass?: string }): ReactNode {
  return (
    <fieldset className={`group${full ? ' full' : ''}`} id={id} aria-labelledby={`${id}-title`}>
      <legend id={`${id}-title`}>{title}</legend>
      <div className={`group-fields${fieldsClass ? ` ${fieldsClass}` : ''}`}>{children}</div>
    </fieldset>
  );
}
