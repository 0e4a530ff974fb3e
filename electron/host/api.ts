/**
 * The one API route, `POST /api/invoke`: `{ "channel": string, "request": any }` in, a `Result`
 * out. The token is checked before the body is even read; without it nothing is dispatched.
 * After that, the same dispatcher the desktop shell uses answers, so validation and errors are
 * identical on both transports.
 */
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Result } from '../ipc/channels.js';
import type { Dispatch } from '../ipc/dispatch.js';
import { BODY_LIMIT_BYTES, readJsonBody } from './body.js';
import { sendJson, sendText } from './respond.js';
import { bearerMatches } from './token.js';

export const API_PATH = '/api/invoke';

const invalid = (message: string): Result<never> => ({ ok: false, error: { code: 'INVALID_INPUT', message } });

export async function handleInvoke(req: IncomingMessage, res: ServerResponse, token: string, dispatch: Dispatch): Promise<void> {
  if (req.method !== 'POST') {
    res.setHeader('Allow', 'POST');
    sendText(res, 405, 'Use POST for /api/invoke.');
    return;
  }
  if (!bearerMatches(req.headers.authorization, token)) {
    req.resume();
    res.setHeader('WWW-Authenticate', 'Bearer');
    sendText(res, 401, 'The access token is missing or wrong. Open the address the host printed when it started.');
    return;
  }
  const body = await readJsonBody(req, BODY_LIMIT_BYTES);
  if (!body.ok) {
    if (body.reason === 'too-large') {
      sendJson(res, 413, invalid(`The request is larger than ${BODY_LIMIT_BYTES / (1024 * 1024)} MB; nothing was saved.`));
    } else if (body.reason === 'not-json') {
      sendJson(res, 400, invalid('The request body is not valid JSON; nothing was saved.'));
    } else {
      res.destroy();
    }
    return;
  }
  const value = body.value;
  if (typeof value !== 'object' || value === null || Array.isArray(value) || typeof (value as { channel?: unknown }).channel !== 'string') {
    sendJson(res, 400, invalid('The request must be an object with a "channel" name and a "request".'));
    return;
  }
  const { channel, request } = value as { channel: string; request?: unknown };
  const result = await dispatch(channel, request);
  sendJson(res, 200, result);
}
