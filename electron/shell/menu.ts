/**
 * The application menu as plain data. The items that do something of ours call `onAction` with a
 * name; main.ts decides what that means (print, load the demo). Everything else is a standard
 * Electron role. There is deliberately no Reload item: the page keeps unsaved form state, and a
 * reload would drop it without asking.
 */
import type { MenuItemConstructorOptions } from 'electron';

export const menuActions = ['print-to-pdf', 'print-to-pdf-letter', 'load-demo'] as const;
export type MenuAction = (typeof menuActions)[number];

/** `devTools`: a development run (window-options.ts `devToolsWanted`); only then does View offer DevTools. */
export function menuTemplate(onAction: (action: MenuAction) => void, platform: string = process.platform, devTools = false): MenuItemConstructorOptions[] {
  const isMac = platform === 'darwin';
  const fileMenu: MenuItemConstructorOptions = {
    label: 'File',
    submenu: [
      { id: 'print-to-pdf', label: 'Print This View to PDF (A4)…', accelerator: 'CmdOrCtrl+P', click: () => onAction('print-to-pdf') },
      { id: 'print-to-pdf-letter', label: 'Print This View to PDF (Letter)…', accelerator: 'CmdOrCtrl+Shift+P', click: () => onAction('print-to-pdf-letter') },
      { type: 'separator' },
      { id: 'load-demo', label: 'Load Demo Workshop', click: () => onAction('load-demo') },
      { type: 'separator' },
      isMac ? { role: 'close' } : { role: 'quit', label: 'Quit' },
    ],
  };
  const editMenu: MenuItemConstructorOptions = {
    label: 'Edit',
    submenu: [
      { role: 'undo' },
      { role: 'redo' },
      { type: 'separator' },
      { role: 'cut' },
      { role: 'copy' },
      { role: 'paste' },
      { role: 'selectAll' },
    ],
  };
  const viewMenu: MenuItemConstructorOptions = {
    label: 'View',
    submenu: [
      { role: 'resetZoom' },
      { role: 'zoomIn' },
      { role: 'zoomOut' },
      { type: 'separator' },
      { role: 'togglefullscreen' },
      ...(devTools ? [{ type: 'separator' as const }, { role: 'toggleDevTools' as const }] : []),
    ],
  };
  const appMenu: MenuItemConstructorOptions[] = isMac
    ? [{ role: 'appMenu', submenu: [{ role: 'about' }, { type: 'separator' }, { role: 'hide' }, { role: 'unhide' }, { type: 'separator' }, { role: 'quit' }] }]
    : [];
  return [...appMenu, fileMenu, editMenu, viewMenu, { role: 'windowMenu' }];
}
