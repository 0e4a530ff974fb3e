/**
 * The browser host's HTTP server: Host check first (403), then the API route or the static
 * build. It knows nothing about processes, signals or where the store lives; web-host.ts does.
 */
import { createServer, type Server } from 'node:http';
import type { Dispatch } from '../ipc/dispatch.js';
import { API_PATH, handleInvoke } from './api.js';
import { isAllowedHost } from './host-header.js';
import { sendJson, sendText } from './respond.js';
import { serveStatic } from './static-files.js';

export type HostServerOptions = { token: string; dispatch: Dispatch; staticRoot: string; onError?: (err: unknown) => void };

/**
 * Node checks the header and request timeouts only on a timer (`connectionsCheckingInterval`,
 * default 30 s, nodejs.org/api/http.html#httpcreateserveroptions-requestlistener), so a client that
 * sends its headers slowly was cut off only after about 30 s, not 10. Checked every second here.
 */
export const HEADERS_TIMEOUT_MS = 10_000;
export const REQUEST_TIMEOUT_MS = 30_000;
export const CONNECTIONS_CHECKING_INTERVAL_MS = 1_000;

export function createHostServer({ token, dispatch, staticRoot, onError = () => {} }: HostServerOptions): Server {
  const options = { headersTimeout: HEADERS_TIMEOUT_MS, requestTimeout: REQUEST_TIMEOUT_MS, connectionsCheckingInterval: CONNECTIONS_CHECKING_INTERVAL_MS };
  const server = createServer(options, (req, res) => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : -1;
    if (!isAllowedHost(req.headers.host, port)) {
      req.resume();
      sendText(res, 403, 'This host answers only to 127.0.0.1 or localhost on its own port.');
      return;
    }
    const pathOnly = (req.url ?? '/').split('?')[0]!;
    if (pathOnly === API_PATH) {
      handleInvoke(req, res, token, dispatch).catch((err: unknown) => {
        onError(err);
        if (!res.headersSent) sendJson(res, 500, { ok: false, error: { code: 'INTERNAL', message: 'The host failed to answer; nothing was saved by this request.' } });
        else res.destroy();
      });
      return;
    }
    if (pathOnly.startsWith('/api/')) {
      req.resume();
      sendText(res, 404, 'There is no such API route.');
      return;
    }
    serveStatic(req, res, staticRoot);
  });
  server.headersTimeout = HEADERS_TIMEOUT_MS;
  server.requestTimeout = REQUEST_TIMEOUT_MS;
  return server;
}
