/**
 * The desktop shell: one window, the menu, the security guards, printing, and the store's
 * lifetime. Everything that decides something lives in small pure modules under ./shell/ (tested
 * without Electron); this file only connects them to Electron's objects.
 */
import { app, BrowserWindow, dialog, ipcMain, Menu, session, shell, type WebContents } from 'electron';
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { resolveDataDir } from '../db/location.js';
import { openBackend } from './ipc/backend.js';
import { externalLinkVerdict, navigationVerdict, windowOpenVerdict } from './shell/guards.js';
import { menuTemplate, type MenuAction } from './shell/menu.js';
import { registerChannels } from './shell/register.js';
import { isTrustedSender } from './shell/sender.js';
import { windowOptions } from './shell/window-options.js';

const PRODUCT_NAME = 'Ignition Planner';

// The bundle lives in dist-electron/; the built renderer in dist/renderer/ beside it.
const here = path.dirname(fileURLToPath(import.meta.url));
const preloadPath = path.join(here, 'preload.cjs');
const indexPath = path.join(here, '..', 'dist', 'renderer', 'index.html');
const appUrl = pathToFileURL(indexPath).href;

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
  const pdf = await win.webContents.printToPDF({ printBackground: false, pageSize, preferCSSPageSize: false });
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
  const win = new BrowserWindow(windowOptions({ preloadPath, title: PRODUCT_NAME }));
  win.once('ready-to-show', () => win.show());
  win.on('closed', () => {
    if (mainWindow === win) mainWindow = null;
  });
  void win.loadFile(indexPath);
  return win;
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

  void app.whenReady().then(() => {
    // The app needs no camera, microphone, location, notifications or anything else.
    session.defaultSession.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
    session.defaultSession.setPermissionCheckHandler(() => false);

    const dataDir = resolveDataDir(process.argv, process.env) ?? app.getPath('userData');
    try {
      backend = openBackend({
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
      dialog.showErrorBox(PRODUCT_NAME, `The workshop store in ${dataDir} could not be opened. ${err instanceof Error ? err.message : String(err)}`);
      app.exit(1);
      return;
    }
    const dispatch = backend.dispatch;
    registerChannels(ipcMain, dispatch, (frameUrl) => isTrustedSender(frameUrl, appUrl));

    Menu.setApplicationMenu(Menu.buildFromTemplate(menuTemplate(onMenuAction)));
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
