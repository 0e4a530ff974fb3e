/**
 * Who may talk to the main process: only the app's own page. In the packaged app that is
 * app://ignition/index.html (shell/app-protocol.ts; a file: page is checked the same way); anything
 * else (another file, a remote page, a data: URL, a
 * page that somehow navigated away) is not ours and its messages are ignored.
 */
export function isTrustedSender(frameUrl: unknown, appUrl: string): boolean {
  if (typeof frameUrl !== 'string' || frameUrl.length === 0 || frameUrl.length > 4096) return false;
  let frame: URL;
  let app: URL;
  try {
    frame = new URL(frameUrl);
    app = new URL(appUrl);
  } catch {
    return false;
  }
  if (frame.protocol !== app.protocol) return false;
  if (app.protocol !== 'http:' && app.protocol !== 'https:') {
    // file: URLs have an opaque origin, so compare the exact file instead; the hash is the
    // renderer's own screen routing and may differ. A query string is never used by the app.
    return frame.host === app.host && frame.pathname === app.pathname && frame.search === '';
  }
  return frame.origin === app.origin && frame.pathname === app.pathname;
}
