/**
 * A file the app made (the workshop JSON, a parts CSV), shown read-only with a copy button and a
 * "save" link. The link is a data: URL with the `download` attribute: the page's CSP has no
 * `blob:` (and needs none for this), a download is not a navigation, and the content is our own
 * text, percent-encoded, never run. The text area is there too so nothing depends on downloads
 * being allowed where the app runs.
 */
import { useState, type ReactNode } from 'react';

export function FileOut({ text, fileName, mime, label, testId }: { text: string; fileName: string; mime: string; label: string; testId: string }): ReactNode {
  const [copied, setCopied] = useState<string | null>(null);
  const href = `data:${mime};charset=utf-8,${encodeURIComponent(text)}`;
  return (
    <div className="file-out" data-testid={testId}>
      <label>
        {label}
        <textarea readOnly rows={10} value={text} spellCheck={false} />
      </label>
      <p>
        <a href={href} download={fileName}>
          Save as {fileName}
        </a>{' '}
        <button
          type="button"
          className="small"
          onClick={() => {
            navigator.clipboard.writeText(text).then(
              () => setCopied('Copied.'),
              () => setCopied('The browser did not allow copying; select the text and copy it by hand.'),
            );
          }}
        >
          Copy
        </button>{' '}
        <span role="status">{copied}</span>
      </p>
    </div>
  );
}
