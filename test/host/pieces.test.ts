/**
 * The host's small pieces on their own: the data-folder default per the XDG Base Directory
 * Specification (specifications.freedesktop.org/basedir-spec: $XDG_DATA_HOME, default
 * $HOME/.local/share; "If an implementation encounters a relative path in any of these
 * variables it should consider the path invalid and ignore it"), the port argument, the token
 * check (RFC 6750 sec. 2.1 `Bearer` credentials), the Host check, and the static resolver
 * against a symbolic link that points out of the build folder.
 */
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { defaultDataDir, parseHostArgs } from '../../electron/host/args.js';
import { isAllowedHost } from '../../electron/host/host-header.js';
import { mimeTypeFor } from '../../electron/host/mime.js';
import { resolveStaticPath } from '../../electron/host/static-files.js';
import { bearerMatches, newToken } from '../../electron/host/token.js';

describe('data folder and port', () => {
  it('defaults to ~/.local/share/ignition-planner, or under an absolute XDG_DATA_HOME', () => {
    expect(defaultDataDir({}, '/home/someone')).toBe('/home/someone/.local/share/ignition-planner');
    expect(defaultDataDir({ XDG_DATA_HOME: '/data/xdg' }, '/home/someone')).toBe('/data/xdg/ignition-planner');
    expect(defaultDataDir({ XDG_DATA_HOME: 'relative/dir' }, '/home/someone')).toBe('/home/someone/.local/share/ignition-planner');
  });

  it('prefers --data-dir, then IGNITION_DATA_DIR, then the default', () => {
    expect(parseHostArgs(['--data-dir', '/a'], { IGNITION_DATA_DIR: '/b' }, '/h').dataDir).toBe('/a');
    expect(parseHostArgs([], { IGNITION_DATA_DIR: '/b' }, '/h').dataDir).toBe('/b');
    expect(parseHostArgs([], {}, '/h').dataDir).toBe('/h/.local/share/ignition-planner');
  });

  it('reads --port N and --port=N, 0 when absent, and refuses nonsense with a sentence', () => {
    expect(parseHostArgs(['--port', '8123'], {}, '/h').port).toBe(8123);
    expect(parseHostArgs(['--port=0'], {}, '/h').port).toBe(0);
    expect(parseHostArgs([], {}, '/h').port).toBe(0);
    for (const bad of ['-1', '65536', 'eighty', '', '80.5']) {
      expect(() => parseHostArgs(['--port', bad], {}, '/h')).toThrow(/--port must be a whole number from 0 to 65535/);
    }
  });
});

describe('token and Host checks', () => {
  it('makes a fresh 32-byte token each time', () => {
    const a = newToken();
    expect(a).toMatch(/^[0-9a-f]{64}$/);
    expect(newToken()).not.toBe(a);
  });

  it('accepts only "Bearer <token>" exactly', () => {
    const t = newToken();
    expect(bearerMatches(`Bearer ${t}`, t)).toBe(true);
    for (const wrong of [undefined, '', t, `bearer ${t}`, `Bearer  ${t}`, `Bearer ${t} `, `Bearer ${newToken()}`]) {
      expect(bearerMatches(wrong, t)).toBe(false);
    }
  });

  it('accepts 127.0.0.1 and localhost on our port only', () => {
    expect(isAllowedHost('127.0.0.1:4000', 4000)).toBe(true);
    expect(isAllowedHost('LOCALHOST:4000', 4000)).toBe(true);
    for (const h of [undefined, '127.0.0.1', '127.0.0.1:4001', '[::1]:4000', 'evil.example:4000', '127.0.0.1:4000.evil.example']) {
      expect(isAllowedHost(h, 4000)).toBe(false);
    }
  });
});

describe('static file resolution', () => {
  const base = mkdtempSync(path.join(os.tmpdir(), 'ignition-static-'));
  const root = path.join(base, 'renderer');
  mkdirSync(path.join(root, 'assets'), { recursive: true });
  writeFileSync(path.join(root, 'index.html'), '<!doctype html>');
  writeFileSync(path.join(root, 'assets', 'app.js'), '1');
  writeFileSync(path.join(base, 'secret.txt'), 'outside');
  symlinkSync(path.join(base, 'secret.txt'), path.join(root, 'assets', 'link.txt'));
  afterAll(() => rmSync(base, { recursive: true, force: true }));

  it('maps / to index.html and an asset to its file and MIME type', () => {
    expect(resolveStaticPath('/', root)).toMatchObject({ ok: true, type: 'text/html; charset=utf-8' });
    expect(resolveStaticPath('/assets/app.js?v=1', root)).toMatchObject({ ok: true, file: path.join(root, 'assets', 'app.js'), type: 'text/javascript; charset=utf-8' });
  });

  it('refuses a symbolic link that leads out of the folder', () => {
    expect(resolveStaticPath('/assets/link.txt', root)).toMatchObject({ ok: false, status: 404 });
  });

  it('refuses dot segments, encoded separators and malformed escapes', () => {
    for (const p of ['/../secret.txt', '/assets/%2e%2e/%2e%2e/secret.txt', '/assets%2f..%2f..%2fsecret.txt', '/%5c..%5csecret.txt', '/%E0%A4%A', '/a%00b']) {
      expect(resolveStaticPath(p, root).ok).toBe(false);
    }
  });

  it('knows the MIME types Vite emits and nothing else', () => {
    expect(mimeTypeFor('a.css')).toBe('text/css; charset=utf-8');
    expect(mimeTypeFor('a.woff2')).toBe('font/woff2');
    expect(mimeTypeFor('a.svg')).toBe('image/svg+xml');
    expect(mimeTypeFor('a.exe')).toBeNull();
    expect(mimeTypeFor('Makefile')).toBeNull();
  });
});
