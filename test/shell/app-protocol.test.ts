/**
 * Issue 8, defect 8: the renderer is served through the app's own scheme, not file:// (Electron
 * security checklist, "Use a custom protocol instead of file://",
 * electronjs.org/docs/latest/tutorial/security). The pure pieces: which request gets which file of
 * the built renderer, and that the sender check and the navigation guard accept exactly the app's
 * page under the new scheme. A real folder on disk stands in for dist/renderer.
 */
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { APP_SCHEME_PRIVILEGES, APP_URL, appRequestVerdict } from '../../electron/shell/app-protocol.js';
import { navigationVerdict } from '../../electron/shell/guards.js';
import { isTrustedSender } from '../../electron/shell/sender.js';

const root = mkdtempSync(path.join(os.tmpdir(), 'ignition-protocol-'));
const outside = mkdtempSync(path.join(os.tmpdir(), 'ignition-outside-'));
mkdirSync(path.join(root, 'assets'));
writeFileSync(path.join(root, 'index.html'), '<!doctype html>');
writeFileSync(path.join(root, 'assets', 'index-abc.js'), 'console.log(1)');
writeFileSync(path.join(outside, 'secret.txt'), 'secret');
symlinkSync(path.join(outside, 'secret.txt'), path.join(root, 'assets', 'link.txt'));
afterAll(() => {
  rmSync(root, { recursive: true, force: true });
  rmSync(outside, { recursive: true, force: true });
});

describe('the app scheme', () => {
  it('is app://ignition/index.html, registered standard and secure and nothing more', () => {
    expect(APP_URL).toBe('app://ignition/index.html');
    expect(APP_SCHEME_PRIVILEGES.privileges).toMatchObject({ standard: true, secure: true, bypassCSP: false, corsEnabled: false, supportFetchAPI: false });
  });

  it('answers the page and its assets with their types', () => {
    expect(appRequestVerdict('app://ignition/index.html', root)).toMatchObject({ ok: true, file: path.join(root, 'index.html'), type: 'text/html; charset=utf-8' });
    expect(appRequestVerdict('app://ignition/assets/index-abc.js?v=1', root)).toMatchObject({ ok: true, type: 'text/javascript; charset=utf-8' });
    expect(appRequestVerdict('app://ignition/', root)).toMatchObject({ ok: true, file: path.join(root, 'index.html') });
  });

  it.each([
    ['another host', 'app://evil/index.html', 404],
    ['a file: address', 'file:///etc/passwd', 404],
    ['dot segments (normalised by the URL parser to a path outside the folder)', 'app://ignition/../../etc/passwd', 404],
    ['encoded dot segments (the URL parser treats %2e%2e as ..)', 'app://ignition/%2e%2e/%2e%2e/etc/passwd', 404],
    ['an encoded slash', 'app://ignition/assets%2f..%2f..%2fetc/passwd', 400],
    ['a symbolic link out of the folder', 'app://ignition/assets/link.txt', 404],
    ['a missing file', 'app://ignition/nothing.js', 404],
    ['a user name in the address', 'app://me@ignition/index.html', 404],
    ['not an address', 'index.html', 400],
    ['not a string', 42, 400],
  ])('refuses %s', (_what, url, status) => {
    expect(appRequestVerdict(url, root)).toMatchObject({ ok: false, status });
  });

  it('the sender check and the navigation guard accept exactly the app page under the scheme', () => {
    expect(isTrustedSender('app://ignition/index.html', APP_URL)).toBe(true);
    expect(isTrustedSender('app://ignition/index.html#/engines', APP_URL)).toBe(true);
    expect(navigationVerdict('app://ignition/index.html#/parts', APP_URL)).toBe('allow');
    for (const other of ['app://evil/index.html', 'app://ignition/other.html', 'app://ignition/index.html?x=1', 'file:///work/dist/renderer/index.html', 'https://ignition/index.html']) {
      expect(isTrustedSender(other, APP_URL), other).toBe(false);
      expect(navigationVerdict(other, APP_URL), other).toBe('deny');
    }
  });
});
