/**
 * The application menu as data. Role names are Electron's documented MenuItem roles
 * (electronjs.org/docs/latest/api/menu-item#roles); the standard edit shortcuts only work in a
 * text field when the Edit menu carries those roles, which is why they must be present.
 */
import type { MenuItemConstructorOptions } from 'electron';
import { describe, expect, it } from 'vitest';
import { menuTemplate, type MenuAction } from '../../electron/shell/menu.js';

function flatten(items: MenuItemConstructorOptions[]): MenuItemConstructorOptions[] {
  return items.flatMap((i) => [i, ...(Array.isArray(i.submenu) ? flatten(i.submenu) : [])]);
}

describe('menuTemplate', () => {
  for (const platform of ['linux', 'win32', 'darwin']) {
    it(`on ${platform}: our items call back with their action, and there is no reload`, () => {
      const seen: MenuAction[] = [];
      const all = flatten(menuTemplate((a) => seen.push(a), platform));
      for (const item of all.filter((i) => i.click)) (item.click as () => void)();
      expect(seen.sort()).toEqual(['load-demo', 'print-to-pdf', 'print-to-pdf-letter']);
      const roles = all.map((i) => i.role).filter(Boolean);
      expect(roles).not.toContain('reload');
      expect(roles).not.toContain('forceReload');
      // A release build offers no DevTools; a development run does.
      expect(roles).not.toContain('toggleDevTools');
      expect(flatten(menuTemplate(() => {}, platform, true)).map((i) => i.role)).toContain('toggleDevTools');
      for (const r of ['undo', 'redo', 'cut', 'copy', 'paste', 'selectAll', 'quit']) expect(roles).toContain(r);
      expect(all.find((i) => i.id === 'print-to-pdf')?.accelerator).toBe('CmdOrCtrl+P');
      expect(all.find((i) => i.id === 'print-to-pdf-letter')?.accelerator).toBe('CmdOrCtrl+Shift+P');
    });
  }
});
