/**
 * DNS-rebinding defence: a web page on some other site can make the browser send requests to
 * 127.0.0.1 under its own host name. The Host header then names that site, so anything but our
 * own loopback address and port is refused.
 */
export function isAllowedHost(hostHeader: string | undefined, port: number): boolean {
  if (typeof hostHeader !== 'string') return false;
  const h = hostHeader.toLowerCase();
  return h === `127.0.0.1:${port}` || h === `localhost:${port}`;
}
