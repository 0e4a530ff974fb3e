/**
 * The renderer's one way to the store. In the desktop window the preload has put a `BridgeApi`
 * on `window.ignitionBridge`; in a plain browser the same API is built over fetch to the local
 * host, using the token the host printed in the address (`#token=...`). Either way every call
 * resolves to a `Result`: a network fault or a garbled answer becomes an error the screen can
 * show, never an exception thrown into React.
 */
import { appError, bridgeGlobalName, channels, type BridgeApi, type ChannelName, type RequestOf, type ResponseOf, type Result } from '../../electron/ipc/channels.js';

const tokenKey = 'ignition-planner.token';

/** Reads `#token=...` once, keeps it for reloads, and takes it out of the address bar. */
export function takeTokenFromAddress(loc: Location = window.location, store: Storage = window.sessionStorage): string | null {
  const hash = loc.hash.startsWith('#') ? loc.hash.slice(1) : loc.hash;
  const params = new URLSearchParams(hash);
  const fromHash = params.get('token');
  if (fromHash) {
    store.setItem(tokenKey, fromHash);
    params.delete('token');
    const rest = params.toString();
    // replaceState, so the token is neither left on screen nor added to the history list.
    window.history.replaceState(null, '', loc.pathname + loc.search + (rest ? `#${rest}` : ''));
    return fromHash;
  }
  return store.getItem(tokenKey);
}

function failure(code: 'INTERNAL' | 'UNSUPPORTED', message: string): Result<never> {
  return { ok: false, error: { code, message } };
}

/**
 * Checks that whatever came back has the Result shape and that a success matches the channel's
 * response schema; anything else is reported plainly instead of reaching a screen half-formed.
 */
function asResult<T>(name: ChannelName, body: unknown): Result<T> {
  if (body && typeof body === 'object' && 'ok' in body) {
    const b = body as { ok: unknown; value?: unknown; error?: unknown };
    if (b.ok === true) {
      const value = channels[name].response.safeParse(b.value);
      if (value.success) return { ok: true, value: value.data as T };
    }
    if (b.ok === false) {
      const err = appError.safeParse(b.error);
      if (err.success) return { ok: false, error: err.data };
    }
  }
  return failure('INTERNAL', 'The workshop answered with something this screen cannot read. Nothing was changed by this screen; try again, and report it if it keeps happening.');
}

/** Builds the browser-side `BridgeApi` over `POST /api/invoke`. */
export function createFetchBridge(token: string | null, base = ''): BridgeApi {
  const invoke = async (channel: ChannelName, request: unknown): Promise<Result<unknown>> => {
    if (!token) {
      return failure('UNSUPPORTED', 'This page was opened without its access key. Open the address the workshop host printed (it ends in #token=...).');
    }
    let response: Response;
    try {
      response = await fetch(`${base}/api/invoke`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${token}` },
        body: JSON.stringify({ channel, request }),
      });
    } catch {
      return failure('INTERNAL', 'Could not reach the workshop host. Is it still running? Start it again and reload this page; nothing typed here has been sent.');
    }
    if (response.status === 401) {
      return failure('UNSUPPORTED', 'The workshop host did not accept this page\'s access key. It changes each time the host starts: open the new address it printed.');
    }
    let body: unknown;
    try {
      body = await response.json();
    } catch {
      return failure('INTERNAL', `The workshop host answered (HTTP ${response.status}) but not in a form this screen can read. Nothing was changed by this screen.`);
    }
    return asResult(channel, body);
  };
  const api = {} as Record<ChannelName, (request: unknown) => Promise<Result<unknown>>>;
  for (const name of Object.keys(channels) as ChannelName[]) api[name] = (request) => invoke(name, request);
  return api as unknown as BridgeApi;
}

/** Wraps the preload's API so that even a rejected promise comes back as a Result. */
function guardDesktop(raw: BridgeApi): BridgeApi {
  const api = {} as Record<ChannelName, (request: unknown) => Promise<Result<unknown>>>;
  for (const name of Object.keys(channels) as ChannelName[]) {
    api[name] = async (request) => {
      try {
        const fn = (raw as unknown as Record<string, ((r: unknown) => Promise<unknown>) | undefined>)[name];
        if (typeof fn !== 'function') return failure('UNSUPPORTED', `This version of the desktop window cannot do "${name}".`);
        return asResult(name, await fn(request));
      } catch {
        return failure('INTERNAL', 'The desktop window did not answer that request. Nothing was changed by this screen; try again.');
      }
    };
  }
  return api as unknown as BridgeApi;
}

let cached: BridgeApi | null = null;

/** The bridge for this page: the desktop one when present, else the browser one. */
export function bridge(): BridgeApi {
  if (cached) return cached;
  const desktop = (window as unknown as Record<string, unknown>)[bridgeGlobalName];
  cached = desktop && typeof desktop === 'object' ? guardDesktop(desktop as BridgeApi) : createFetchBridge(takeTokenFromAddress());
  return cached;
}

/** Convenience: `call('engines.list', {})` with the right types. */
export function call<C extends ChannelName>(channel: C, request: RequestOf<C>): Promise<Result<ResponseOf<C>>> {
  return (bridge()[channel] as (r: RequestOf<C>) => Promise<Result<ResponseOf<C>>>)(request);
}
