/**
 * The window's security switches, each checked against the Electron security checklist
 * (electronjs.org/docs/latest/tutorial/security): "Enable context isolation", "Enable process
 * sandboxing", "Do not enable Node.js integration for remote content", "Do not disable
 * webSecurity", "Do not allow insecure content", "Do not enable experimental features",
 * "Do not use <webview>" (the tag is off unless asked for).
 */
import { describe, expect, it } from 'vitest';
import { devToolsWanted, windowOptions } from '../../electron/shell/window-options.js';

const options = windowOptions({ preloadPath: '/app/dist-electron/preload.cjs', title: 'Ignition Planner' });
const prefs = options.webPreferences!;

describe('windowOptions', () => {
  it('has DevTools off unless a development run asks for them (--dev-tools or IGNITION_DEV_TOOLS=1)', () => {
    expect(prefs.devTools).toBe(false);
    expect(windowOptions({ preloadPath: '/p.cjs', title: 'x', devTools: true }).webPreferences!.devTools).toBe(true);
    expect(devToolsWanted(['electron', '.'], {})).toBe(false);
    expect(devToolsWanted(['electron', '.'], { IGNITION_DEV_TOOLS: '0', NODE_ENV: 'development' })).toBe(false);
    expect(devToolsWanted(['electron', '.', '--dev-tools'], {})).toBe(true);
    expect(devToolsWanted(['electron', '.'], { IGNITION_DEV_TOOLS: '1' })).toBe(true);
  });

  it('isolates the page from the preload and sandboxes the renderer', () => {
    expect(prefs.contextIsolation).toBe(true);
    expect(prefs.sandbox).toBe(true);
  });

  it('gives the page no Node.js, in the page, workers or sub-frames', () => {
    expect(prefs.nodeIntegration).toBe(false);
    expect(prefs.nodeIntegrationInWorker).toBe(false);
    expect(prefs.nodeIntegrationInSubFrames).toBe(false);
  });

  it('keeps the same-origin policy and refuses mixed content, webviews and experimental features', () => {
    expect(prefs.webSecurity).toBe(true);
    expect(prefs.allowRunningInsecureContent).toBe(false);
    expect(prefs.webviewTag).toBe(false);
    expect(prefs.experimentalFeatures).toBe(false);
    expect(prefs.navigateOnDragDrop).toBe(false);
  });

  it('turns the spell checker off (it would send typed text to a dictionary service)', () => {
    expect(prefs.spellcheck).toBe(false);
  });

  it('uses the preload path it is given, as an absolute path', () => {
    expect(prefs.preload).toBe('/app/dist-electron/preload.cjs');
    expect(windowOptions({ preloadPath: '/elsewhere/p.cjs', title: 'x' }).webPreferences!.preload).toBe('/elsewhere/p.cjs');
  });

  it('sets no option that would load remote content or open a second process world', () => {
    const keys = Object.keys(prefs);
    for (const risky of ['additionalArguments', 'partition', 'enableBlinkFeatures', 'session', 'zoomFactor']) {
      expect(keys).not.toContain(risky);
    }
    expect(options.show).toBe(false);
    expect(options.title).toBe('Ignition Planner');
  });
});
