/**
 * The real browser host in a child process, on a fresh data folder. Expected behaviour per the
 * project's transport contract and the outside rules it rests on: RFC 6750 (Bearer tokens;
 * 401 with WWW-Authenticate when missing or wrong), RFC 9110 (403 refused, 405 with Allow,
 * 413 content too large), the DNS-rebinding defence of checking Host (OWASP, "DNS rebinding"),
 * and RFC 3986 sec. 5.2.4 dot-segments, which a file server must never resolve outside its root.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { engine } from '../../db/schema.js';
import { engineInput } from '../fixtures/engine-input.js';
import { invoke, rawRequest, READY_LINE, startHost, type RunningHost } from './host-process.js';

const root = path.resolve(import.meta.dirname, '../..');
const builtIndex = path.join(root, 'dist/renderer/index.html');
let dataDir: string;
let host: RunningHost;

beforeAll(async () => {
  if (!existsSync(builtIndex)) throw new Error('dist/renderer/index.html is missing: run npm run build:renderer first.');
  dataDir = mkdtempSync(path.join(os.tmpdir(), 'ignition-host-'));
  host = await startHost(dataDir);
});

afterAll(async () => {
  host?.signal('SIGKILL');
  await host?.exited;
  rmSync(dataDir, { recursive: true, force: true });
});

const post = (body: string, headers: Record<string, string>) => rawRequest(host.port, { method: 'POST', path: '/api/invoke', headers, body });
const good = () => ({ Authorization: `Bearer ${host.token}`, 'Content-Type': 'application/json' });

describe('browser host: start-up', () => {
  it('prints exactly one line on stdout: the address with a 64-hex-digit token', () => {
    expect(host.stdoutLines).toHaveLength(1);
    expect(host.stdoutLines[0]).toMatch(READY_LINE);
    expect(host.port).toBeGreaterThan(0);
  });

  it('keeps the store in the data folder it was given', async () => {
    const { json } = await invoke(host, 'app.info', {});
    expect(json).toMatchObject({ ok: true, value: { host: 'browser', dataDir } });
    expect(existsSync(path.join(dataDir, 'workshop.sqlite3'))).toBe(true);
  });
});

describe('browser host: access to the API', () => {
  it('answers 401 without a token, and dispatches nothing', async () => {
    const before = (await invoke(host, 'engines.list', {})).json.value.length as number;
    const res = await post(JSON.stringify({ channel: 'engines.create', request: { engine: engineInput({ name: 'Sneaked in' }) } }), {
      'Content-Type': 'application/json',
    });
    expect(res.status).toBe(401);
    expect(res.headers['www-authenticate']).toBe('Bearer');
    const after = (await invoke(host, 'engines.list', {})).json.value as Array<{ name: string }>;
    expect(after).toHaveLength(before);
    expect(after.map((e) => e.name)).not.toContain('Sneaked in');
  });

  it.each([
    ['a different token', () => `Bearer ${'0'.repeat(64)}`],
    ['the token in upper case', () => `Bearer ${host.token.toUpperCase()}`],
    ['the token without the Bearer scheme', () => host.token],
    ['the token with a trailing character', () => `Bearer ${host.token}0`],
    ['the token cut short', () => `Bearer ${host.token.slice(0, 63)}`],
    ['Basic authentication', () => `Basic ${Buffer.from(`x:${host.token}`).toString('base64')}`],
  ])('answers 401 for %s', async (_what, header) => {
    const res = await post(JSON.stringify({ channel: 'app.info', request: {} }), { Authorization: header(), 'Content-Type': 'application/json' });
    expect(res.status).toBe(401);
  });

  it.each([
    ['another site (DNS rebinding)', () => 'evil.example'],
    ['another site on our port', () => `evil.example:${host.port}`],
    ['our address on another port', () => `127.0.0.1:${host.port + 1}`],
    ['our address without a port', () => '127.0.0.1'],
    ['a look-alike', () => `127.0.0.1.evil.example:${host.port}`],
  ])('answers 403 for a Host header naming %s, even with the right token', async (_what, hostHeader) => {
    const api = await post(JSON.stringify({ channel: 'app.info', request: {} }), { ...good(), Host: hostHeader() });
    expect(api.status).toBe(403);
    const page = await rawRequest(host.port, { path: '/', headers: { Host: hostHeader() } });
    expect(page.status).toBe(403);
  });

  it('accepts localhost on our port as well as 127.0.0.1', async () => {
    const res = await post(JSON.stringify({ channel: 'app.info', request: {} }), { ...good(), Host: `localhost:${host.port}` });
    expect(res.status).toBe(200);
  });

  it('saves and reads back an engine with the right token', async () => {
    const created = await invoke(host, 'engines.create', { engine: engineInput({ name: 'Host test four' }) });
    expect(created.status).toBe(200);
    expect(created.json.ok).toBe(true);
    expect(engine.safeParse(created.json.value).success).toBe(true);
    const got = await invoke(host, 'engines.get', { id: created.json.value.id });
    expect(got.json).toEqual({ ok: true, value: created.json.value });
  });

  it('only accepts POST on /api/invoke', async () => {
    for (const method of ['GET', 'PUT', 'DELETE']) {
      const res = await rawRequest(host.port, { method, path: '/api/invoke', headers: good() });
      expect(res.status).toBe(405);
      expect(res.headers['allow']).toBe('POST');
    }
  });

  it('answers a body that is not JSON with a typed INVALID_INPUT error', async () => {
    const res = await post('{"channel": "app.info", ', good());
    expect(res.status).toBe(400);
    expect(JSON.parse(res.body)).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
    const notObject = await post('[1,2,3]', good());
    expect(JSON.parse(notObject.body)).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
  });

  it('refuses a body over 1 MB with 413 and a JSON error, saving nothing', async () => {
    const before = (await invoke(host, 'engines.list', {})).json.value.length as number;
    const huge = JSON.stringify({ channel: 'engines.create', request: { engine: engineInput({ notes: 'x'.repeat(1024 * 1024 + 10) }) } });
    const res = await post(huge, good());
    expect(res.status).toBe(413);
    expect(JSON.parse(res.body)).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
    expect((await invoke(host, 'engines.list', {})).json.value).toHaveLength(before);
  });

  it('passes malformed requests and unknown channels to the dispatcher\'s typed errors', async () => {
    const bad = await invoke(host, 'engines.create', { engine: engineInput({ cylinders: 0 }) });
    expect(bad.status).toBe(200);
    expect(bad.json).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT', fields: { 'engine.cylinders': expect.any(String) } } });
    const unknown = await invoke(host, 'engines.drop', {});
    expect(unknown.json).toMatchObject({ ok: false, error: { code: 'UNKNOWN_CHANNEL' } });
  });
});

describe('browser host: static files', () => {
  it('serves the built index.html at / with the strict CSP header, without a token', async () => {
    const res = await rawRequest(host.port, { path: '/' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(res.headers['content-security-policy']).toMatch(/^default-src 'none'; script-src 'self'/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.body).toBe(readFileSync(builtIndex, 'utf8'));
  });

  it('serves the page\'s script and stylesheet with their MIME types (RFC 9239 text/javascript)', async () => {
    const html = readFileSync(builtIndex, 'utf8');
    const script = /<script[^>]*src="\.?(\/[^"]+\.js)"/.exec(html)?.[1];
    const style = /<link[^>]*href="\.?(\/[^"]+\.css)"/.exec(html)?.[1];
    expect(script).toBeDefined();
    const js = await rawRequest(host.port, { path: script! });
    expect(js.status).toBe(200);
    expect(js.headers['content-type']).toBe('text/javascript; charset=utf-8');
    // The renderer's build always links its stylesheet (renderer/styles/app.css, bundled): a page
    // without one would be unstyled, so its absence fails rather than skips.
    expect(style, 'the built page links a stylesheet').toBeDefined();
    const css = await rawRequest(host.port, { path: style! });
    expect(css.status).toBe(200);
    expect(css.headers['content-type']).toBe('text/css; charset=utf-8');
    expect(css.body).toBe(readFileSync(path.join(path.dirname(builtIndex), style!), 'utf8'));
  });

  it.each([
    '/../package.json',
    '/../../../../etc/passwd',
    '/assets/../../package.json',
    '/%2e%2e/package.json',
    '/%2E%2E/%2E%2E/package.json',
    '/assets/..%2f..%2fpackage.json',
    '/..%5c..%5cpackage.json',
    '/assets/%2e%2e%2f%2e%2e%2fpackage.json',
    '/./index.html/../../package.json',
    '//etc/passwd',
    '/index.html%00.js',
    '/.env',
  ])('refuses the traversal %s', async (p) => {
    const res = await rawRequest(host.port, { path: p });
    expect([400, 404]).toContain(res.status);
    expect(res.body).not.toContain('"devDependencies"');
    expect(res.body).not.toContain('root:');
  });

  it('answers 404 for a file that does not exist and 405 for POST to a page', async () => {
    expect((await rawRequest(host.port, { path: '/no-such-file.js' })).status).toBe(404);
    expect((await rawRequest(host.port, { method: 'POST', path: '/', body: 'x' })).status).toBe(405);
  });
});

describe('browser host: shutting down', () => {
  it('closes the store on SIGTERM: exit code 0 and SQLite removes the WAL on the last close', async () => {
    // sqlite.org/wal.html: "When the last connection to a database closes, that connection does
    // one last checkpoint and then deletes the WAL and its associated shared-memory file."
    const dir = mkdtempSync(path.join(os.tmpdir(), 'ignition-host-term-'));
    try {
      const h = await startHost(dir, 'node');
      await invoke(h, 'engines.create', { engine: engineInput({ name: 'Before shutdown' }) });
      expect(existsSync(path.join(dir, 'workshop.sqlite3-wal'))).toBe(true);
      h.child.kill('SIGTERM');
      const { code } = await h.exited;
      expect(code).toBe(0);
      expect(h.stderr()).toContain('the store is closed');
      expect(existsSync(path.join(dir, 'workshop.sqlite3-wal'))).toBe(false);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
