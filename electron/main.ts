/**
 * The desktop shell: one window, the menu, the security guards, printing, and the store's
 * lifetime. Everything that decides something lives in small pure modules under ./shell/ (tested
 * without Electron); this file only connects them to Electron's objects.
 */
import { app, BrowserWindow, dialog, ipcMain, Menu, protocol, session, shell, type WebContents } from 'electron';
import { writeFileSync } from 'node:fs';
import { readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { exportWorkshop } from '../db/exchange/index.js';
import { resolveDataDir, STORE_FILE_NAME } from '../db/location.js';
import { openReadOnly } from '../db/open.js';
import { newestUsableBackup, replaceWithNewestBackup } from '../db/recover.js';
import { describeStartupProblem } from '../db/startup-problem.js';
import { openBackend } from './ipc/backend.js';
import { externalLinkVerdict, navigationVerdict, windowOpenVerdict } from './shell/guards.js';
import { menuTemplate, type MenuAction } from './shell/menu.js';
import { APP_SCHEME, APP_SCHEME_PRIVILEGES, APP_URL, appRequestVerdict } from './shell/app-protocol.js';
import { CONTENT_SECURITY_POLICY_HEADER } from './shell/csp.js';
import { pdfOptions } from './shell/print-options.js';
import { registerChannels } from './shell/register.js';
import { startupChoices } from './shell/startup-choices.js';
import { isTrustedSender } from './shell/sender.js';
import { devToolsWanted, windowOptions } from './shell/window-options.js';

const PRODUCT_NAME = 'Ignition Planner';

// The bundle lives in dist-electron/; the built renderer in dist/renderer/ beside it.
const here = path.dirname(fileURLToPath(import.meta.url));
const preloadPath = path.join(here, 'preload.cjs');
const rendererRoot = path.join(here, '..', 'dist', 'renderer');
// Served through the app's own scheme (shell/app-protocol.ts), never from file://.
const appUrl = APP_URL;

let backend: ReturnType<typeof openBackend> | null = null;
let mainWindow: BrowserWindow | null = null;

function closeStore(): void {
  // Idempotent: quit paths can arrive twice (window-all-closed, then will-quit).
  const b = backend;
  backend = null;
  b?.close();
}

/** Applied to every web contents the app ever creates, including any the page might try to open. */
function guardContents(contents: WebContents): void {
  contents.on('will-navigate', (event, url) => {
    if (navigationVerdict(url, appUrl) === 'allow') return;
    event.preventDefault();
    openIfPlainWebLink(url);
  });
  contents.on('will-redirect', (event, url) => {
    if (navigationVerdict(url, appUrl) !== 'allow') event.preventDefault();
  });
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(({ url }) => {
    const verdict = windowOpenVerdict(url);
    if (verdict.openExternally.open) void shell.openExternal(verdict.openExternally.url);
    return { action: verdict.action };
  });
}

function openIfPlainWebLink(url: unknown): void {
  const verdict = externalLinkVerdict(url);
  if (verdict.open) void shell.openExternal(verdict.url);
}

/**
 * Prints what the window shows now to a PDF the user saves. The renderer's print stylesheet decides
 * what appears (the wiring sheet prints black on white, with its own page numbers), so backgrounds
 * are left off. Used by the File menu and by the screens' Print button (the 'app.print' channel).
 */
async function printCurrentViewToPdf(win: BrowserWindow, pageSize: 'A4' | 'Letter'): Promise<{ saved: boolean; path: string | null }> {
  const pdf = await win.webContents.printToPDF(pdfOptions(pageSize));
  const choice = await dialog.showSaveDialog(win, {
    title: 'Save this view as PDF',
    defaultPath: path.join(app.getPath('documents'), 'wiring-sheet.pdf'),
    filters: [{ name: 'PDF document', extensions: ['pdf'] }],
  });
  if (choice.canceled || !choice.filePath) return { saved: false, path: null };
  await writeFile(choice.filePath, pdf);
  return { saved: true, path: choice.filePath };
}

async function loadDemoWorkshop(win: BrowserWindow): Promise<void> {
  if (!backend) return;
  const result = await backend.dispatch('demo.load', {});
  if (!result.ok) {
    await dialog.showMessageBox(win, { type: 'error', message: 'The demo workshop could not be loaded.', detail: result.error.message });
    return;
  }
  const added = result.value as { enginesAdded: number; partsAdded: number; plansAdded: number };
  await dialog.showMessageBox(win, {
    type: 'info',
    message: 'Demo workshop loaded.',
    detail: `Added ${added.enginesAdded} engines, ${added.partsAdded} parts and ${added.plansAdded} plans. Nothing of yours was changed.`,
  });
  // The page reads the store through the bridge only, so it is reloaded to show the new records.
  win.webContents.reload();
}

function onMenuAction(action: MenuAction): void {
  const win = BrowserWindow.getFocusedWindow() ?? mainWindow;
  if (!win) return;
  const run =
    action === 'load-demo' ? loadDemoWorkshop(win) : printCurrentViewToPdf(win, action === 'print-to-pdf-letter' ? 'Letter' : 'A4').then(() => undefined);
  run.catch((err: unknown) => {
    dialog.showErrorBox(PRODUCT_NAME, `That did not work: ${err instanceof Error ? err.message : String(err)}`);
  });
}

function createWindow(): BrowserWindow {
  const win = new BrowserWindow(windowOptions({ preloadPath, title: PRODUCT_NAME, devTools: devToolsWanted(process.argv, process.env) }));
  win.once('ready-to-show', () => win.show());
  win.on('closed', () => {
    if (mainWindow === win) mainWindow = null;
  });
  void win.loadURL(appUrl);
  return win;
}

/**
 * Opens the store; if it will not open, says why in a sentence with the file's path and offers the
 * ways out (db/startup-problem.ts): the newest backup (the damaged file is moved aside with the date,
 * never overwritten), another folder, or a read-only export of what can be read. Null: quit.
 */
function openWithWayOut(firstDir: string): ReturnType<typeof openBackend> | null {
  let dataDir = firstDir;
  for (;;) {
    try {
      return openBackend({
        dataDir,
        host: 'desktop',
        version: app.getVersion(),
        // The screens' Print button: the window is looked up when asked, since the store opens first.
        print: (pageSize) => {
          const win = BrowserWindow.getFocusedWindow() ?? mainWindow;
          return win ? printCurrentViewToPdf(win, pageSize) : Promise.resolve({ saved: false, path: null });
        },
      });
    } catch (err) {
      const file = path.join(dataDir, STORE_FILE_NAME);
      const q = startupChoices(describeStartupProblem(err, file, dataDir), newestUsableBackup(dataDir));
      const pick = dialog.showMessageBoxSync({ type: 'error', title: PRODUCT_NAME, message: 'The workshop could not be opened.', detail: q.detail, buttons: q.buttons, defaultId: 0, cancelId: q.buttons.length - 1, noLink: true });
      const choice = q.choices[pick] ?? 'quit';
      try {
        if (choice === 'newest-backup') {
          const r = replaceWithNewestBackup(dataDir);
          dialog.showMessageBoxSync({ type: 'info', title: PRODUCT_NAME, message: 'The newest backup is in place.', detail: `Restored from ${r.restoredFrom}. The damaged file was kept as ${r.movedTo}.` });
        } else if (choice === 'other-folder') {
          const picked = dialog.showOpenDialogSync({ title: 'Choose a folder for the workshop', properties: ['openDirectory', 'createDirectory'] });
          if (picked?.[0]) dataDir = picked[0];
        } else if (choice === 'read-only-export') {
          exportReadOnly(file);
          return null;
        } else if (choice === 'quit') {
          return null;
        }
      } catch (wayErr) {
        dialog.showErrorBox(PRODUCT_NAME, `That did not work: ${wayErr instanceof Error ? wayErr.message : String(wayErr)}`);
      }
    }
  }
}

/** Opens the file read-only (nothing is written) and saves what can be read as a workshop file. */
function exportReadOnly(file: string): void {
  const target = dialog.showSaveDialogSync({ title: 'Export what can be read', defaultPath: path.join(app.getPath('documents'), 'workshop-rescued.json'), filters: [{ name: 'Workshop file', extensions: ['json'] }] });
  if (!target) return;
  const db = openReadOnly(file);
  try {
    const r = exportWorkshop(db);
    writeFileSync(target, JSON.stringify(r.workshop, null, 2));
    const lost = r.unreadable.length > 0 ? ` ${r.unreadable.length} record(s) could not be read and were left out.` : '';
    dialog.showMessageBoxSync({ type: 'info', title: PRODUCT_NAME, message: 'Exported what could be read.', detail: `Saved ${r.counts.engines} engines, ${r.counts.parts} parts and ${r.counts.plans} plans to ${target}.${lost}` });
  } finally {
    db.close();
  }
}

function start(): void {
  // Two copies of the app on one store file would fight over it; the second one hands over.
  if (!app.requestSingleInstanceLock()) {
    app.quit();
    return;
  }
  app.on('second-instance', () => {
    if (mainWindow) {
      if (mainWindow.isMinimized()) mainWindow.restore();
      mainWindow.focus();
    }
  });
  app.on('web-contents-created', (_event, contents) => guardContents(contents));
  // Must be said before the app is ready.
  protocol.registerSchemesAsPrivileged([APP_SCHEME_PRIVILEGES]);

  void app.whenReady().then(() => {
    // The app needs no camera, microphone, location, notifications or anything else.
    session.defaultSession.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
    session.defaultSession.setPermissionCheckHandler(() => false);
    // The renderer's files, and nothing else, with the same CSP header the browser host sends.
    protocol.handle(APP_SCHEME, async (request) => {
      const found = appRequestVerdict(request.url, rendererRoot);
      if (!found.ok) return new Response(found.reason, { status: found.status, headers: { 'content-type': 'text/plain; charset=utf-8' } });
      return new Response(await readFile(found.file), {
        headers: { 'content-type': found.type, 'content-security-policy': CONTENT_SECURITY_POLICY_HEADER, 'x-content-type-options': 'nosniff' },
      });
    });

    backend = openWithWayOut(resolveDataDir(process.argv, process.env) ?? app.getPath('userData'));
    if (!backend) {
      app.exit(1);
      return;
    }
    const dispatch = backend.dispatch;
    registerChannels(ipcMain, dispatch, (frameUrl) => isTrustedSender(frameUrl, appUrl));

    Menu.setApplicationMenu(Menu.buildFromTemplate(menuTemplate(onMenuAction, process.platform, devToolsWanted(process.argv, process.env))));
    mainWindow = createWindow();

    app.on('activate', () => {
      if (BrowserWindow.getAllWindows().length === 0) mainWindow = createWindow();
    });
  });

  app.on('window-all-closed', () => {
    if (process.platform !== 'darwin') app.quit();
  });
  app.on('will-quit', closeStore);
  // A terminal's Ctrl-C or a service manager's stop goes through the normal quit, so the store
  // is closed (checkpointed) rather than left to recover from its WAL on the next start.
  process.on('SIGINT', () => app.quit());
  process.on('SIGTERM', () => app.quit());
}

start();
