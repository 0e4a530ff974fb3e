/**
 * The browser host's command line: `--data-dir DIR` (or IGNITION_DATA_DIR, via db/location.ts)
 * and `--port N` (0 or absent: any free port). Without a data dir it uses the XDG data folder,
 * `~/.local/share/ignition-planner` unless XDG_DATA_HOME says otherwise.
 */
import os from 'node:os';
import path from 'node:path';
import { resolveDataDir } from '../../db/location.js';

export type HostArgs = { dataDir: string; port: number };

export class HostArgsError extends Error {
  override readonly name = 'HostArgsError';
}

export function defaultDataDir(env: Record<string, string | undefined>, home: string = os.homedir()): string {
  const xdg = env['XDG_DATA_HOME'];
  // The XDG spec says a relative XDG_DATA_HOME is invalid and must be ignored.
  const base = xdg && path.isAbsolute(xdg) ? xdg : path.join(home, '.local', 'share');
  return path.join(base, 'ignition-planner');
}

export function parseHostArgs(argv: string[], env: Record<string, string | undefined>, home?: string): HostArgs {
  let portText: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--port') portText = argv[i + 1] ?? '';
    else if (arg.startsWith('--port=')) portText = arg.slice('--port='.length);
  }
  let port = 0;
  if (portText !== undefined) {
    if (!/^\d{1,5}$/.test(portText) || Number(portText) > 65535) {
      throw new HostArgsError(`--port must be a whole number from 0 to 65535 (0 picks a free port); got ${JSON.stringify(portText)}.`);
    }
    port = Number(portText);
  }
  return { dataDir: resolveDataDir(argv, env) ?? defaultDataDir(env, home), port };
}
