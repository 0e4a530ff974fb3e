/**
 * Serves the built renderer. Static files hold no data, so they need no token; what matters is
 * that a request can only ever read a file inside the build folder. A path with `..`, an encoded
 * slash or backslash, a NUL, or one that resolves (through a symbolic link too) outside the
 * folder is refused.
 */
import { createReadStream, realpathSync, statSync } from 'node:fs';
import type { IncomingMessage, ServerResponse } from 'node:http';
import path from 'node:path';
import { CONTENT_SECURITY_POLICY_HEADER } from '../shell/csp.js';
import { mimeTypeFor } from './mime.js';
import { sendText } from './respond.js';

export type StaticResolution = { ok: true; file: string; type: string } | { ok: false; status: 400 | 404; reason: string };

/** Maps a request path to a file inside `root`, or says why not. Pure apart from reading the disk. */
export function resolveStaticPath(rawPath: string, root: string): StaticResolution {
  const pathOnly = rawPath.split('?')[0]!.split('#')[0]!;
  let decoded: string;
  try {
    decoded = decodeURIComponent(pathOnly);
  } catch {
    return { ok: false, status: 400, reason: 'The address is not valid.' };
  }
  if (!decoded.startsWith('/') || decoded.includes('\0') || decoded.includes('\\')) {
    return { ok: false, status: 400, reason: 'The address is not valid.' };
  }
  // Refuse rather than normalise: no legitimate asset address has a dot segment, and an
  // encoded slash inside a segment is a sign of someone probing.
  const rawSegments = pathOnly.split('/');
  if (rawSegments.some((s) => /%2f|%5c|%00/i.test(s))) return { ok: false, status: 400, reason: 'The address is not valid.' };
  const segments = decoded.split('/');
  if (segments.some((s) => s === '..' || s === '.')) return { ok: false, status: 400, reason: 'The address is not valid.' };

  const relative = decoded === '/' ? 'index.html' : decoded.slice(1);
  if (segments.some((s) => s.startsWith('.') && s.length > 0)) return { ok: false, status: 404, reason: 'Not found.' };
  let realRoot: string;
  let real: string;
  try {
    realRoot = realpathSync(root);
    real = realpathSync(path.join(realRoot, relative));
  } catch {
    return { ok: false, status: 404, reason: 'Not found.' };
  }
  if (real !== realRoot && !real.startsWith(realRoot + path.sep)) return { ok: false, status: 404, reason: 'Not found.' };
  try {
    if (!statSync(real).isFile()) return { ok: false, status: 404, reason: 'Not found.' };
  } catch {
    return { ok: false, status: 404, reason: 'Not found.' };
  }
  const type = mimeTypeFor(real);
  if (!type) return { ok: false, status: 404, reason: 'Not found.' };
  return { ok: true, file: real, type };
}

export function serveStatic(req: IncomingMessage, res: ServerResponse, root: string): void {
  if (req.method !== 'GET' && req.method !== 'HEAD') {
    res.setHeader('Allow', 'GET, HEAD');
    sendText(res, 405, 'Only GET and HEAD are served here.');
    return;
  }
  const found = resolveStaticPath(req.url ?? '/', root);
  if (!found.ok) {
    sendText(res, found.status, found.status === 404 && (req.url === '/' || req.url?.startsWith('/index.html'))
      ? 'The screens are not built yet: run npm run build:renderer.'
      : found.reason);
    return;
  }
  res.statusCode = 200;
  res.setHeader('Content-Type', found.type);
  res.setHeader('Content-Security-Policy', CONTENT_SECURITY_POLICY_HEADER);
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Referrer-Policy', 'no-referrer');
  res.setHeader('Cache-Control', 'no-store');
  if (req.method === 'HEAD') {
    res.end();
    return;
  }
  const stream = createReadStream(found.file);
  stream.on('error', () => res.destroy());
  stream.pipe(res);
}
