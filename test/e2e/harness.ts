/**
 * What the end-to-end tests stand on: the real browser host (electron/web-host.ts) on a fresh
 * data folder, the built renderer, and Debian's Chromium driven through playwright-core. Nothing
 * is mocked. A missing Chromium or renderer build fails the run with a message naming it.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, expect } from 'vitest';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const chromiumPath = '/usr/bin/chromium';
export const outputDir = path.join(projectRoot, 'test-output');
const rendererIndex = path.join(projectRoot, 'dist', 'renderer', 'index.html');
const tsxBin = path.join(projectRoot, 'node_modules', '.bin', 'tsx');

const made: string[] = [];

export function freshDir(label: string): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), `ignition-e2e-${label}-`));
  made.push(dir);
  return dir;
}

/** Removes the data and profile folders this run made (call once hosts and browsers are closed). */
export function removeFreshDirs(): void {
  for (const dir of made.splice(0)) rmSync(dir, { recursive: true, force: true });
}

/** Fails (never skips) when the browser or the renderer build is not there. */
export function requireBrowserAndRenderer(): void {
  if (!existsSync(chromiumPath)) {
    throw new Error(`Chromium is missing: expected the Debian chromium package at ${chromiumPath} (apt-get install chromium).`);
  }
  if (!existsSync(rendererIndex)) {
    const built = spawnSync('npm', ['run', 'build:renderer'], { cwd: projectRoot, encoding: 'utf8', env: { ...process.env, ELECTRON_SKIP_BINARY_DOWNLOAD: '1' } });
    if (built.status !== 0 || !existsSync(rendererIndex)) {
      throw new Error(`The built renderer is missing (${rendererIndex}) and "npm run build:renderer" failed:\n${built.stdout}\n${built.stderr}`);
    }
  }
  mkdirSync(outputDir, { recursive: true });
}

export type Host = { url: string; origin: string; token: string; dataDir: string; stop(): Promise<void> };

/** Starts `tsx electron/web-host.ts --data-dir DIR --port 0` and waits for its one ready line. */
export function startHost(dataDir: string): Promise<Host> {
  const child: ChildProcess = spawn(tsxBin, ['electron/web-host.ts', '--data-dir', dataDir, '--port', '0'], {
    cwd: projectRoot,
    stdio: ['ignore', 'pipe', 'pipe'],
    // Its own process group, so stop() reaches tsx and the node process it starts.
    detached: true,
  });
  let stderr = '';
  child.stderr?.on('data', (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const stop = async (): Promise<void> => {
    if (child.exitCode === null && child.signalCode === null && child.pid) {
      try {
        process.kill(-child.pid, 'SIGTERM');
      } catch {
        // already gone
      }
      await exited;
    }
  };
  return new Promise((resolve, reject) => {
    let stdout = '';
    const timer = setTimeout(() => {
      void stop();
      reject(new Error(`The browser host did not print its ready line within 30 s.\nstderr:\n${stderr}`));
    }, 30_000);
    child.stdout?.on('data', (d: Buffer) => {
      stdout += d.toString();
      const m = /^Serving at (http:\/\/127\.0\.0\.1:\d+)\/#token=([0-9a-f]{64})$/m.exec(stdout);
      if (m) {
        clearTimeout(timer);
        resolve({ url: `${m[1]}/#token=${m[2]}`, origin: m[1]!, token: m[2]!, dataDir, stop });
      }
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`The browser host stopped before it was ready (exit ${code}).\nstderr:\n${stderr}`));
    });
  });
}

/** Calls the host's API directly, as the outside view of what the store holds. */
export async function api<T = unknown>(host: Host, channel: string, request: unknown): Promise<T> {
  const res = await fetch(`${host.origin}/api/invoke`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${host.token}` },
    body: JSON.stringify({ channel, request }),
  });
  const body = (await res.json()) as { ok: boolean; value?: T; error?: { code: string; message: string } };
  if (!body.ok) throw new Error(`${channel} failed: ${body.error?.code} ${body.error?.message}`);
  return body.value as T;
}

/** `blocked` lists every address the page tried to reach outside the local host. */
export type Browser = { context: BrowserContext; page: Page; blocked: string[]; pageErrors: string[]; close(): Promise<void> };

export async function openBrowser(): Promise<Browser> {
  const profile = freshDir('profile');
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: chromiumPath,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    viewport: { width: 1280, height: 800 },
  });
  // Nothing may leave the machine: any request not to the local host is refused.
  const blocked: string[] = [];
  await context.route(/^(?!http:\/\/127\.0\.0\.1[:/]).*/, (route) => {
    blocked.push(route.request().url());
    return route.abort('blockedbyclient');
  });
  const page = context.pages()[0] ?? (await context.newPage());
  // Uncaught exceptions and console errors (a CSP refusal is reported there) are collected.
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(`uncaught: ${err.message}`));
  page.on('console', (msg) => {
    if (msg.type() === 'error') pageErrors.push(`console: ${msg.text()}`);
  });
  return { context, page, blocked, pageErrors, close: () => context.close() };
}

export async function screenshot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(outputDir, `${name}.png`), fullPage: false });
}

export type Workshop = { host: Host; browser: Browser; page: Page };

/**
 * The lifecycle every end-to-end file shares; call it once at the top of the file. It fails the
 * file early without Chromium or the build, closes each test's hosts and browsers after the test
 * (last opened first), and removes the fresh folders when the file is done. Hosts and browsers
 * started through it are closed that way.
 */
export function e2eSuite(): { startHost(dataDir: string): Promise<Host>; startWorkshop(dataDir?: string): Promise<Workshop> } {
  const cleanups: Array<() => Promise<void>> = [];
  afterEach(async () => {
    while (cleanups.length) await cleanups.pop()!().catch(() => {});
  });
  beforeAll(() => requireBrowserAndRenderer());
  afterAll(() => removeFreshDirs());

  const trackedHost = async (dataDir: string): Promise<Host> => {
    const host = await startHost(dataDir);
    cleanups.push(() => host.stop());
    return host;
  };
  return {
    startHost: trackedHost,
    /** A host on `dataDir` (a fresh folder by default) and a browser showing the app's first screen. */
    async startWorkshop(dataDir = freshDir('data')): Promise<Workshop> {
      const host = await trackedHost(dataDir);
      const browser = await openBrowser();
      cleanups.push(() => browser.close());
      await openApp(browser.page, host);
      return { host, browser, page: browser.page };
    },
  };
}

/**
 * Loads the app from `host` and brings it to the engines. The app opens on the screen the person
 * was last on (kept in the store's settings), so on a folder used before it may open elsewhere.
 */
export async function openApp(page: Page, host: Host): Promise<void> {
  await page.goto(host.url);
  const engines = page.getByRole('heading', { level: 1, name: 'Engines' });
  await page.locator('main h1').first().waitFor();
  if ((await engines.count()) === 0) await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Engines' }).click();
  await engines.waitFor();
}

/** Moves to a screen through the side list and waits for its heading. */
export async function openScreen(page: Page, name: string): Promise<void> {
  await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name }).click();
  await page.getByRole('heading', { level: 1, name }).waitFor();
}

/** The message shown beside a field must be the one the field is described by. */
export async function messageBeside(page: Page, label: string, fieldPath: string): Promise<string> {
  const error = page.getByTestId(`error-${fieldPath}`);
  await error.waitFor();
  const field = page.getByLabel(label, { exact: true });
  const [errorId, describedBy] = await Promise.all([error.getAttribute('id'), field.getAttribute('aria-describedby')]);
  expect(describedBy?.split(' ')).toContain(errorId);
  expect(await field.getAttribute('aria-invalid')).toBe('true');
  return (await error.innerText()).replace(/^!\s*/, '').trim();
}
