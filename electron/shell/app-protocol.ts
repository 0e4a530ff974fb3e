/**
 * The app's own scheme. The renderer is served as `app://ignition/index.html` through
 * `protocol.handle` instead of from `file://`: Electron's security checklist ("Use a custom
 * protocol instead of file://") because a file: page has an opaque origin and `file://` would let a
 * navigation or a script reach any file the user can read. Only files inside the built renderer
 * folder are answered (the browser host's `resolveStaticPath`: no `..`, no NUL, no symbolic link
 * out); everything else is 404. Pure pieces here; main.ts registers them.
 */
import { resolveStaticPath, type StaticResolution } from '../host/static-files.js';

export const APP_SCHEME = 'app';
export const APP_HOST = 'ignition';
export const APP_URL = `${APP_SCHEME}://${APP_HOST}/index.html`;

/**
 * For `protocol.registerSchemesAsPrivileged` (before the app is ready): a standard scheme (so it
 * has an origin and relative URLs resolve), secure (like https, so CSP 'self' and secure-context
 * rules apply), and nothing more (no fetch from other origins, no CORS, no service workers).
 */
export const APP_SCHEME_PRIVILEGES = {
  scheme: APP_SCHEME,
  privileges: { standard: true, secure: true, supportFetchAPI: false, corsEnabled: false, allowServiceWorkers: false, bypassCSP: false, stream: false },
} as const;

/** Which file answers a request to the app scheme, or the status to answer instead. */
export function appRequestVerdict(url: unknown, root: string): StaticResolution {
  if (typeof url !== 'string' || url.length > 2048) return { ok: false, status: 400, reason: 'not a usable address' };
  let u: URL;
  try {
    u = new URL(url);
  } catch {
    return { ok: false, status: 400, reason: 'not a usable address' };
  }
  if (u.protocol !== `${APP_SCHEME}:` || u.host !== APP_HOST || u.username !== '' || u.password !== '') {
    return { ok: false, status: 404, reason: 'not the app' };
  }
  return resolveStaticPath(u.pathname, root);
}
