/**
 * Wires every channel of the map to ipcMain. Each message's sender is checked first: a message from
 * anything but the app's own top-level page is ignored (answered with `undefined`, logged) and
 * never reaches the dispatcher, so a stray frame cannot read or change the store.
 */
import { channels, type ChannelName } from '../ipc/channels.js';
import type { Dispatch } from '../ipc/dispatch.js';

/** The part of Electron's IpcMainInvokeEvent we rely on. */
export type InvokeEventLike = {
  senderFrame?: { url: string; parent?: unknown } | null;
};

/** The part of Electron's ipcMain we rely on; a plain object with `handle` stands in for tests. */
export type IpcMainLike = {
  handle(channel: string, listener: (event: InvokeEventLike, ...args: unknown[]) => unknown): void;
};

export type Logger = (message: string) => void;

export function registerChannels(
  ipc: IpcMainLike,
  dispatch: Dispatch,
  isTrusted: (frameUrl: string) => boolean,
  log: Logger = (m) => console.warn(m),
): ChannelName[] {
  const names = Object.keys(channels) as ChannelName[];
  for (const name of names) {
    ipc.handle(name, async (event, request) => {
      const frame = event?.senderFrame;
      // A null frame means the sender has navigated or been destroyed since it sent the message.
      const isTopFrame = frame != null && (frame.parent === undefined || frame.parent === null);
      const url = frame?.url;
      if (!isTopFrame || typeof url !== 'string' || !isTrusted(url)) {
        log(`Ignored the ${name} request from an unknown sender (${typeof url === 'string' ? url.slice(0, 120) : 'no frame'}).`);
        return undefined;
      }
      return dispatch(name, request);
    });
  }
  return names;
}
