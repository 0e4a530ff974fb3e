/**
 * Reads a JSON request body with a size limit. A body over the limit is cut off as soon as it
 * passes the limit (the declared Content-Length is checked first), so a runaway client cannot
 * fill the host's memory.
 */
import type { IncomingMessage } from 'node:http';

export const BODY_LIMIT_BYTES = 1024 * 1024;

export type BodyResult =
  | { ok: true; value: unknown }
  | { ok: false; reason: 'too-large' }
  | { ok: false; reason: 'not-json'; detail: string }
  | { ok: false; reason: 'aborted' };

export function readJsonBody(req: IncomingMessage, limit: number = BODY_LIMIT_BYTES): Promise<BodyResult> {
  return new Promise((resolve) => {
    const declared = Number(req.headers['content-length']);
    if (Number.isFinite(declared) && declared > limit) {
      req.resume(); // drain without keeping anything
      resolve({ ok: false, reason: 'too-large' });
      return;
    }
    const chunks: Buffer[] = [];
    let size = 0;
    let done = false;
    const finish = (r: BodyResult) => {
      if (done) return;
      done = true;
      resolve(r);
    };
    req.on('data', (chunk: Buffer) => {
      if (done) return;
      size += chunk.length;
      if (size > limit) {
        chunks.length = 0;
        req.resume();
        finish({ ok: false, reason: 'too-large' });
        return;
      }
      chunks.push(chunk);
    });
    req.on('aborted', () => finish({ ok: false, reason: 'aborted' }));
    req.on('error', () => finish({ ok: false, reason: 'aborted' }));
    req.on('end', () => {
      if (done) return;
      const text = Buffer.concat(chunks).toString('utf8');
      try {
        finish({ ok: true, value: JSON.parse(text) as unknown });
      } catch (err) {
        finish({ ok: false, reason: 'not-json', detail: err instanceof Error ? err.message : String(err) });
      }
    });
  });
}
