/**
 * The browser host's access token: 32 random bytes per run, shown once in the printed address.
 * Any local program can reach 127.0.0.1, so the token is what makes the store answer only to the
 * page the user opened from that address.
 */
import { randomBytes, timingSafeEqual } from 'node:crypto';

export function newToken(): string {
  return randomBytes(32).toString('hex');
}

/** True only for `Bearer <token>` exactly; compared in constant time. */
export function bearerMatches(authorization: string | undefined, token: string): boolean {
  if (typeof authorization !== 'string') return false;
  const m = /^Bearer ([0-9a-f]{64})$/.exec(authorization);
  if (!m) return false;
  const given = Buffer.from(m[1]!, 'utf8');
  const expected = Buffer.from(token, 'utf8');
  return given.length === expected.length && timingSafeEqual(given, expected);
}
