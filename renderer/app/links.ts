/**
 * No link may take the app page somewhere else. Web links (http/https, another origin) open
 * outside the app — a new browser tab here, the system browser in the desktop window, whose
 * main process denies window.open and hands the address on — and everything else is ignored.
 */
export type LinkDecision = 'open-outside' | 'ignore' | 'in-page';

export function decideLink(href: string, pageHref: string): LinkDecision {
  let url: URL;
  let page: URL;
  try {
    page = new URL(pageHref);
    url = new URL(href, page);
  } catch {
    return 'ignore';
  }
  // Compared by protocol, host and path rather than `origin`, which is "null" for file:// pages.
  const samePage = url.protocol === page.protocol && url.host === page.host && url.pathname === page.pathname;
  if (samePage && url.hash !== '') return 'in-page';
  const web = url.protocol === 'https:' || url.protocol === 'http:';
  if (web && !(url.protocol === page.protocol && url.host === page.host)) return 'open-outside';
  return 'ignore';
}

/** Installs the one click handler for the whole page; returns its removal. */
export function guardLinks(doc: Document = document): () => void {
  const onClick = (e: MouseEvent): void => {
    const target = e.target instanceof Element ? e.target.closest('a[href]') : null;
    if (!(target instanceof HTMLAnchorElement)) return;
    const decision = decideLink(target.getAttribute('href') ?? '', window.location.href);
    if (decision === 'in-page') return;
    e.preventDefault();
    if (decision === 'open-outside') window.open(target.href, '_blank', 'noopener,noreferrer');
  };
  doc.addEventListener('click', onClick, true);
  doc.addEventListener('auxclick', onClick, true);
  return () => {
    doc.removeEventListener('click', onClick, true);
    doc.removeEventListener('auxclick', onClick, true);
  };
}
