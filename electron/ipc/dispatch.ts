/**
 * The dispatcher: the single place a message from the renderer is checked and answered.
 * Both transports (Electron's ipcMain and the browser host's HTTP) call `dispatch`, so the
 * validation, the error envelope and the handlers are identical on both.
 */
import type { z } from 'zod';
import { fieldMessages } from '../../db/schema.js';
import { channels, isChannelName, type ChannelName, type Channels, type ResponseOf, type Result } from './channels.js';
import { AppFailure } from './failure.js';

/** A handler receives the parsed request and returns the response (or throws AppFailure). */
export type Handlers = {
  [C in ChannelName]: (request: z.output<Channels[C]['request']>) => ResponseOf<C> | Promise<ResponseOf<C>>;
};

export type Dispatch = (channel: unknown, payload: unknown) => Promise<Result<unknown>>;

export function createDispatcher(handlers: Handlers, onInternalError: (err: unknown) => void = () => {}): Dispatch {
  return async (channel, payload) => {
    if (!isChannelName(channel)) {
      return { ok: false, error: { code: 'UNKNOWN_CHANNEL', message: `There is no request called ${JSON.stringify(String(channel)).slice(0, 80)}.` } };
    }
    const spec = channels[channel];
    const parsed = spec.request.safeParse(payload ?? {});
    if (!parsed.success) {
      return {
        ok: false,
        error: { code: 'INVALID_INPUT', message: 'Some values need correcting before this can be saved.', fields: fieldMessages(parsed.error) },
      };
    }
    try {
      const handler = handlers[channel] as (req: unknown) => unknown;
      const value = await handler(parsed.data);
      // The response is checked too: a handler bug must surface here, not as a confusing screen.
      const out = spec.response.safeParse(value);
      if (!out.success) {
        onInternalError(out.error);
        return { ok: false, error: { code: 'INTERNAL', message: `The answer to ${channel} was malformed; nothing further was changed. Please report this.` } };
      }
      return { ok: true, value: out.data };
    } catch (err) {
      if (err instanceof AppFailure) return { ok: false, error: err.toAppError() };
      onInternalError(err);
      return { ok: false, error: { code: 'INTERNAL', message: `Something went wrong answering ${channel}; nothing was saved by this request.` } };
    }
  };
}
