/**
 * The Content Security Policy the app's page runs under. Only our own bundled scripts, styles and
 * fonts load; nothing may be fetched from, framed by, or posted to anywhere else. The renderer's
 * index.html carries the same string in a meta tag (a test compares the built file with this one),
 * and the browser host also sends it as a header.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'self'",
  "style-src 'self'",
  "img-src 'self' data:",
  "font-src 'self'",
  "connect-src 'self'",
  "base-uri 'none'",
  "form-action 'none'",
  "object-src 'none'",
].join('; ');

/**
 * The header form adds what a meta tag cannot express: the page may not be framed by anyone.
 */
export const CONTENT_SECURITY_POLICY_HEADER = `${CONTENT_SECURITY_POLICY}; frame-ancestors 'none'`;
