/**
 * Starts the real browser host as a child process, waits for its one ready line, and offers raw HTTP requests (node:http, so the test controls the exact path and
 * Host header; fetch would normalise `..` and refuse to set Host).
 *
 * `via: 'npx'` runs exactly `npx tsx electron/web-host.ts ...` (three processes: npx, tsx, node).
 * `via: 'node'` runs `node --import tsx electron/web-host.ts ...`, the same loader in one process,
 * so a signal and the exit code are the host's own. Either way the child leads its own process
 * group, and `signal` reaches every process in it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { request } from 'node:http';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');
export const READY_LINE = /^Serving at http:\/\/127\.0\.0\.1:(\d+)\/#token=([0-9a-f]{64})$/;

export type RunningHost = {
  child: ChildProcess;
  port: number;
  token: string;
  stdoutLines: string[];
  stderr: () => string;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  signal: (sig: NodeJS.Signals) => void;
};

export async function startHost(dataDir: string, via: 'npx' | 'node' = 'npx', timeoutMs = 60_000): Promise<RunningHost> {
  const hostArgs = ['electron/web-host.ts', '--data-dir', dataDir, '--port', '0'];
  const [command, args] = via === 'npx' ? ['npx', ['tsx', ...hostArgs]] : [process.execPath, ['--import', 'tsx', ...hostArgs]];
  const child = spawn(command, args, {
    cwd: root,
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: { ...process.env, IGNITION_DATA_DIR: '' },
  });
  let out = '';
  let err = '';
  const stdoutLines: string[] = [];
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.on('exit', (code, signal) => resolve({ code, signal })),
  );
  child.stderr!.on('data', (d: Buffer) => (err += d.toString()));
  const ready = new Promise<{ port: number; token: string }>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`host not ready after ${timeoutMs} ms; stderr: ${err}`)), timeoutMs);
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      let nl: number;
      while ((nl = out.indexOf('\n')) >= 0) {
        const line = out.slice(0, nl);
        out = out.slice(nl + 1);
        stdoutLines.push(line);
        const m = READY_LINE.exec(line);
        if (m) {
          clearTimeout(timer);
          resolve({ port: Number(m[1]), token: m[2]! });
        }
      }
    });
    void exited.then(({ code, signal }) => {
      clearTimeout(timer);
      reject(new Error(`host exited (${code ?? signal}) before it was ready; stderr: ${err}`));
    });
  });
  const { port, token } = await ready;
  const signal = (sig: NodeJS.Signals) => {
    try {
      process.kill(-child.pid!, sig);
    } catch {
      /* already gone */
    }
  };
  return { child, port, token, stdoutLines, stderr: () => err, exited, signal };
}

export type RawResponse = { status: number; headers: Record<string, string | string[] | undefined>; body: string };

export function rawRequest(
  port: number,
  opts: { method?: string; path: string; headers?: Record<string, string>; body?: string | Buffer },
): Promise<RawResponse> {
  return new Promise((resolve, reject) => {
    const req = request(
      { host: '127.0.0.1', port, method: opts.method ?? 'GET', path: opts.path, headers: { Host: `127.0.0.1:${port}`, ...opts.headers }, agent: false },
      (res) => {
        let body = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (body += c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
      },
    );
    req.on('error', reject);
    if (opts.body !== undefined) req.write(opts.body);
    req.end();
  });
}

/** POST /api/invoke with the host's token; answers the parsed Result and the status. */
export async function invoke(host: { port: number; token: string }, channel: string, requestBody: unknown): Promise<{ status: number; json: any }> {
  const res = await rawRequest(host.port, {
    method: 'POST',
    path: '/api/invoke',
    headers: { Authorization: `Bearer ${host.token}`, 'Content-Type': 'application/json' },
    body: JSON.stringify({ channel, request: requestBody }),
  });
  return { status: res.status, json: JSON.parse(res.body) };
}
