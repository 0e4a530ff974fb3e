/**
 * The options of the one application window. Every security switch is spelled out even where it
 * matches Electron's default, so a future default change cannot loosen the app silently.
 */
import type { BrowserWindowConstructorOptions } from 'electron';

export type WindowOptionsInput = {
  /** Absolute path of the bundled preload (dist-electron/preload.cjs). */
  preloadPath: string;
  title: string;
  /** DevTools: only in a development run (`devToolsWanted`); off in every release build. */
  devTools?: boolean;
};

/**
 * Whether this run is a development run that may open DevTools: the `--dev-tools` switch or
 * IGNITION_DEV_TOOLS=1. Nothing else turns them on (Electron's security checklist: DevTools give
 * whoever sits at the machine the bridge to the store).
 */
export function devToolsWanted(argv: readonly string[], env: Record<string, string | undefined>): boolean {
  return argv.includes('--dev-tools') || env['IGNITION_DEV_TOOLS'] === '1';
}

export function windowOptions({ preloadPath, title, devTools = false }: WindowOptionsInput): BrowserWindowConstructorOptions {
  return {
    title,
    width: 1280,
    height: 860,
    minWidth: 900,
    minHeight: 600,
    show: false, // shown on 'ready-to-show' so the user never sees an unstyled flash
    backgroundColor: '#ffffff',
    webPreferences: {
      preload: preloadPath,
      // The page and the preload live in separate JavaScript worlds; the page sees only the bridge.
      contextIsolation: true,
      // The renderer process runs in Chromium's OS-level sandbox: no Node, no file system.
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      nodeIntegrationInSubFrames: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      webviewTag: false,
      experimentalFeatures: false,
      navigateOnDragDrop: false,
      spellcheck: false,
      devTools,
      safeDialogs: true,
    },
  };
}
