/**
 * Guards for everything that could take the user away from the app's own page. They are pure
 * functions of an `unknown` input so that look-alike URLs can be tried in a unit test without
 * launching anything; the caller performs the side effect (opening the system browser) only after
 * a verdict says so.
 *
 * The hazard: a link in a note or an imported part list that looks like a web address but is
 * really a file on disk, a script, or a different host than the one shown. Such a link must never
 * load inside the app window (which holds the bridge to the store) and must never reach the
 * system's URL handler unless it is plainly an http(s) address on a named host.
 */

export type Verdict = 'allow' | 'deny';
export type ExternalLinkVerdict = { open: true; url: string } | { open: false };

const MAX_URL_LENGTH = 2048;

/**
 * Navigation of the app window: allowed only to the app's own page (same file, or for an http
 * origin the same origin and path). Everything else is denied; links leave through
 * `externalLinkVerdict` instead.
 */
export function navigationVerdict(url: unknown, appUrl: string): Verdict {
  if (typeof url !== 'string' || url.length > MAX_URL_LENGTH || !isPlainAscii(url)) return 'deny';
  let target: URL;
  let app: URL;
  try {
    target = new URL(url);
    app = new URL(appUrl);
  } catch {
    return 'deny';
  }
  if (target.protocol !== app.protocol || target.username !== '' || target.password !== '') return 'deny';
  // file: and the app's own scheme (app://ignition/...): the exact host and file, no query.
  if (app.protocol !== 'http:' && app.protocol !== 'https:') {
    return target.host === app.host && target.pathname === app.pathname && target.search === '' ? 'allow' : 'deny';
  }
  return target.origin === app.origin && target.pathname === app.pathname ? 'allow' : 'deny';
}

/**
 * `window.open` and target=_blank: a new app window is never created. If the address is a
 * plain web link it may be handed to the system browser; otherwise nothing happens.
 */
export function windowOpenVerdict(url: unknown): { action: 'deny'; openExternally: ExternalLinkVerdict } {
  return { action: 'deny', openExternally: externalLinkVerdict(url) };
}

/**
 * Whether a link may be opened in the system browser, and the exact normalised address to open.
 * Only http: and https: with a real, named host; no user name or password part (the classic
 * `https://trusted.example@evil.example` trick); no backslashes, whitespace, control or
 * non-ASCII characters in what was written (browsers "repair" those into a different address than
 * the one a person reads); no single-label, numeric or punycode hosts.
 */
export function externalLinkVerdict(url: unknown): ExternalLinkVerdict {
  if (typeof url !== 'string' || url.length === 0 || url.length > MAX_URL_LENGTH) return { open: false };
  if (!isPlainAscii(url) || url.includes('\\')) return { open: false };
  // The raw text must itself start with the scheme and two slashes: the URL parser would turn
  // `http:/example.com` or `http:example.com` into a valid address, but a person did not write one.
  const written = /^(https?):\/\/([^/?#]*)/i.exec(url);
  if (!written) return { open: false };
  const writtenAuthority = written[2]!;
  if (writtenAuthority.includes('@') || writtenAuthority.includes('%')) return { open: false };

  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return { open: false };
  }
  if (parsed.protocol !== 'http:' && parsed.protocol !== 'https:') return { open: false };
  if (parsed.username !== '' || parsed.password !== '') return { open: false };
  if (!isNamedHost(parsed.hostname)) return { open: false };
  // What the parser understood as the host must be what was written (less case and port).
  const writtenHost = writtenAuthority.replace(/:\d{1,5}$/, '').toLowerCase();
  if (writtenHost !== parsed.hostname) return { open: false };
  return { open: true, url: parsed.href };
}

/** Printable ASCII only: no spaces, tabs, newlines, NUL, zero-width or look-alike letters. */
function isPlainAscii(s: string): boolean {
  return /^[\x21-\x7e]+$/.test(s);
}

/** A DNS name with at least two labels and an alphabetic top-level label; no IP literals. */
function isNamedHost(hostname: string): boolean {
  if (hostname.length === 0 || hostname.length > 253) return false;
  const labels = hostname.split('.');
  if (labels.length < 2) return false;
  for (const label of labels) {
    if (!/^[a-z0-9](?:[a-z0-9-]{0,61}[a-z0-9])?$/.test(label)) return false;
    if (label.startsWith('xn--')) return false; // punycode can spell a look-alike of a known name
  }
  return /^[a-z]{2,63}$/.test(labels[labels.length - 1]!);
}
