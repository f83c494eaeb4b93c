import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { fileURLToPath } from 'node:url';

/** The compiled server, reached the same way from src/bench (tests) and dist/bench (benchmarks). */
export const BUILT_MAIN = fileURLToPath(new URL('../../dist/main.js', import.meta.url));

export function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

export interface Exit {
  code: number | null;
  signal: NodeJS.Signals | null;
}

export interface BuiltServer {
  base: string;
  child: ChildProcess;
  exited: Promise<Exit>;
  output: () => string;
  /** Sends the signal and resolves when the process has gone. */
  stop: (signal?: NodeJS.Signals) => Promise<Exit>;
}

const tail = (text: string) => text.slice(-3000);

/** Spawns the built server with exactly these settings (plus PATH) and resolves once /api/health answers. */
export async function startBuiltServer(env: Record<string, string>, timeoutMs = 60_000): Promise<BuiltServer> {
  // Other programs on the machine may take the free port before the server binds it: try another one.
  for (let attempt = 1; ; attempt++) {
    try {
      return await startOnce(env, timeoutMs);
    } catch (error) {
      if (env.PORT || attempt >= 3 || !/EADDRINUSE/.test((error as Error).message)) throw error;
    }
  }
}

async function startOnce(env: Record<string, string>, timeoutMs: number): Promise<BuiltServer> {
  const port = env.PORT ? Number(env.PORT) : await freePort();
  const child = spawn(process.execPath, [BUILT_MAIN], {
    env: { PATH: process.env.PATH ?? '', ...env, PORT: String(port) },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<Exit>((resolve) => child.once('exit', (code, signal) => resolve({ code, signal })));
  let gone: Exit | null = null;
  void exited.then((exit) => (gone = exit));
  const base = `http://127.0.0.1:${port}`;
  const server: BuiltServer = {
    base,
    child,
    exited,
    output: () => output,
    stop: (signal = 'SIGTERM') => {
      if (!gone) child.kill(signal);
      return exited;
    },
  };
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (gone) throw new Error(`The built server stopped (${JSON.stringify(gone)}):\n${tail(output)}`);
    const up = await fetch(`${base}/api/health`)
      .then((r) => r.ok)
      .catch(() => false);
    if (up) return server;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  await server.stop('SIGKILL');
  throw new Error(`The built server did not answer within ${timeoutMs} ms:\n${tail(output)}`);
}

/** Runs the built server expecting it to refuse to start: resolves with its exit and what it printed. */
export function refusedStart(env: Record<string, string>, timeoutMs = 30_000): Promise<Exit & { output: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [BUILT_MAIN], {
      env: { PATH: process.env.PATH ?? '', ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new Error(`The server did not refuse to start within ${timeoutMs} ms:\n${output}`));
    }, timeoutMs);
    child.once('exit', (code, signal) => {
      clearTimeout(timer);
      resolve({ code, signal, output });
    });
  });
}

export async function signIn(base: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`Sign-in of ${email} answered ${res.status}`);
  return ((await res.json()) as { accessToken: string }).accessToken;
}
