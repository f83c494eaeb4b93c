/**
 * POST /api/evaluate (a typical study) beside GET /api/health on the same server: requests per second and median
 * latency at concurrency 1 and 8 over keep-alive connections, then the slowest health answer while one heavy
 * request is served. The server runs in a child process (`evaluate-bench.js serve`) on a fresh SQLite file with
 * the demo accounts; its throttler counts every request with the real limits but its refusals are ignored, so that
 * the loops can run longer than the per-account allowance of the evaluate route. `--cpu-prof` writes the server's CPU profile.
 */
import 'reflect-metadata';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { Agent, request } from 'node:http';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { typicalStudy } from './report-bench.js';

const WARM_UP_MS = 1500;
const MEASURE_MS = 4000;
const DEMO_ANALYST = { email: 'analyst@meritline.test', password: 'meritline-demo' };

async function serve(): Promise<void> {
  const { Test } = await import('@nestjs/testing');
  const { ThrottlerStorage, ThrottlerStorageService } = await import('@nestjs/throttler');
  const { AppModule } = await import('../app.module.js');
  const { configureApp } = await import('../configure-app.js');

  /**
   * The real storage, limits and bookkeeping; only its verdict is ignored. (A limit no benchmark reaches would let the
   * account's list of hits grow to every request of the last minute, a cost no served account has.)
   */
  class UnrefusingStorage extends ThrottlerStorageService {
    override async increment(key: string, ttl: number, limit: number, blockDuration: number, name: string) {
      return { ...(await super.increment(key, ttl, limit, blockDuration, name)), isBlocked: false };
    }
  }
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] })
    .overrideProvider(ThrottlerStorage)
    .useValue(new UnrefusingStorage())
    .compile();
  const app = configureApp(moduleRef.createNestApplication({ bodyParser: false, logger: ['error'] }));
  await app.listen(0, '127.0.0.1');
  const address = app.getHttpServer().address() as { port: number };
  process.stdout.write(`listening ${address.port}\n`);
  process.once('SIGTERM', () => void app.close().then(() => process.exit(0)));
}

interface Answer {
  status: number;
  body: string;
  ms: number;
}

function send(agent: Agent, port: number, method: string, path: string, token?: string, body?: string): Promise<Answer> {
  const start = performance.now();
  return new Promise((resolve, reject) => {
    const req = request(
      {
        agent,
        host: '127.0.0.1',
        port,
        method,
        path,
        headers: {
          ...(token ? { authorization: `Bearer ${token}` } : {}),
          ...(body ? { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) } : {}),
        },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () =>
          resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString(), ms: performance.now() - start }),
        );
        res.on('error', reject);
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

interface LoopFigures {
  perSecond: number;
  medianMs: number;
  /** Server process CPU time (user + system, every thread) per request: the figure other load on the machine does not inflate. */
  serverCpuMs: number;
}

/** CPU time of a process so far, in ms (Linux /proc; clock ticks of 10 ms). */
function cpuMsOf(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10;
}

const print = (line: string) => process.stdout.write(`${line}\n`);
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] ?? NaN;

/** `concurrency` keep-alive loops, each sending the next request when the last answer is in. */
async function loop(port: number, pid: number, concurrency: number, call: (agent: Agent) => Promise<Answer>): Promise<LoopFigures> {
  const agent = new Agent({ keepAlive: true, maxSockets: concurrency });
  const run = async (until: number, latencies: number[] | null) => {
    while (performance.now() < until) {
      const answer = await call(agent);
      if (answer.status !== 200) throw new Error(`answered ${answer.status}: ${answer.body.slice(0, 200)}`);
      latencies?.push(answer.ms);
    }
  };
  const warmUntil = performance.now() + WARM_UP_MS;
  await Promise.all(Array.from({ length: concurrency }, () => run(warmUntil, null)));
  const latencies: number[] = [];
  const cpuStart = cpuMsOf(pid);
  const start = performance.now();
  await Promise.all(Array.from({ length: concurrency }, () => run(start + MEASURE_MS, latencies)));
  const elapsed = performance.now() - start;
  const serverCpuMs = (cpuMsOf(pid) - cpuStart) / latencies.length;
  agent.destroy();
  return { perSecond: (latencies.length * 1000) / elapsed, medianMs: median(latencies), serverCpuMs };
}

/** The slowest health answer, polled back to back, while `heavy` is served. */
async function healthDuring(port: number, heavy: () => Promise<Answer>): Promise<{ heavyMs: number; maxHealthMs: number; polls: number }> {
  const agent = new Agent({ keepAlive: true, maxSockets: 1 });
  let done = false;
  const heavyAnswer = heavy().finally(() => {
    done = true;
  });
  let maxHealthMs = 0;
  let polls = 0;
  while (!done) {
    const answer = await send(agent, port, 'GET', '/api/health');
    maxHealthMs = Math.max(maxHealthMs, answer.ms);
    polls++;
  }
  const answer = await heavyAnswer;
  if (answer.status !== 200) throw new Error(`heavy request answered ${answer.status}: ${answer.body.slice(0, 200)}`);
  agent.destroy();
  return { heavyMs: answer.ms, maxHealthMs, polls };
}

function startServer(dir: string, profile: boolean): Promise<{ child: ChildProcess; port: number }> {
  const script = fileURLToPath(import.meta.url);
  const args = [
    ...(profile ? ['--cpu-prof', `--cpu-prof-dir=${join(process.cwd(), 'test-output', 'cpu-profiles')}`] : []),
    script,
    'serve',
  ];
  const child = spawn(process.execPath, args, {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: `sqlite:${join(dir, 'bench.sqlite')}`,
      DATA_DIR: dir,
      SMTP_URL: '',
      API_DOCS: 'false',
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    let out = '';
    child.stdout?.on('data', (chunk: Buffer) => {
      out += chunk.toString();
      const found = /listening (\d+)/.exec(out);
      if (found) resolve({ child, port: Number(found[1]) });
    });
    child.once('exit', (code) => reject(new Error(`the server stopped (exit ${code}) before listening`)));
  });
}

/** Invented standards on 500 levels × 10 replicates: the largest list a study may hold. */
function heavyStudy(): string {
  const standards = Array.from({ length: 5000 }, (_, i) => {
    const x = 0.5 + Math.floor(i / 10) / 10;
    return { x, y: 0.02 + 0.31 * x + 0.004 * Math.sin(7 * i) };
  });
  return JSON.stringify({ standards, unknowns: [{ id: 'U1', y: [5.1, 5.2] }] });
}

async function main(): Promise<void> {
  const profile = process.argv.includes('--profile');
  const dir = mkdtempSync(join(tmpdir(), 'meritline-bench-'));
  const { child, port } = await startServer(dir, profile);
  try {
    const agent = new Agent({ keepAlive: true });
    const login = await send(agent, port, 'POST', '/api/auth/login', undefined, JSON.stringify(DEMO_ANALYST));
    if (login.status !== 200) throw new Error(`sign-in answered ${login.status}: ${login.body}`);
    const token = (JSON.parse(login.body) as { accessToken: string }).accessToken;
    const study = JSON.stringify(typicalStudy());
    const answer = await send(agent, port, 'POST', '/api/evaluate', token, study);
    if (answer.status !== 200) throw new Error(`evaluate answered ${answer.status}: ${answer.body.slice(0, 300)}`);

    print(
      `node ${process.version}, ${cpus().length} cores, load average ${loadavg()
        .map((l) => l.toFixed(1))
        .join(' ')}; ${MEASURE_MS / 1000} s per figure after ${WARM_UP_MS / 1000} s warm-up; evaluate answer ${answer.body.length} bytes`,
    );
    print('route | concurrency | requests/s | median ms | server CPU ms per request');
    const tiny = JSON.stringify({ standards: [1, 2, 3].map((x) => ({ x, y: 0.1 + 2 * x })) });
    for (const concurrency of [1, 8]) {
      const health = await loop(port, child.pid as number, concurrency, (a) => send(a, port, 'GET', '/api/health'));
      const evaluate = await loop(port, child.pid as number, concurrency, (a) => send(a, port, 'POST', '/api/evaluate', token, study));
      print(
        `GET /api/health | ${concurrency} | ${health.perSecond.toFixed(0)} | ${health.medianMs.toFixed(2)} | ${health.serverCpuMs.toFixed(2)}`,
      );
      print(
        `POST /api/evaluate | ${concurrency} | ${evaluate.perSecond.toFixed(0)} | ${evaluate.medianMs.toFixed(2)} | ${evaluate.serverCpuMs.toFixed(2)}`,
      );
      print(
        `evaluate ÷ health at concurrency ${concurrency}: ${((100 * evaluate.perSecond) / health.perSecond).toFixed(1)} % of the requests per second, ` +
          `${((100 * health.serverCpuMs) / evaluate.serverCpuMs).toFixed(1)} % by server CPU per request`,
      );
    }
    // Where the difference goes: a signed-in route without a body, then the evaluate route with the smallest study.
    const me = await loop(port, child.pid as number, 1, (a) => send(a, port, 'GET', '/api/auth/me', token));
    const small = await loop(port, child.pid as number, 1, (a) => send(a, port, 'POST', '/api/evaluate', token, tiny));
    print(
      `GET /api/auth/me (signed in, no body) | 1 | ${me.perSecond.toFixed(0)} | ${me.medianMs.toFixed(2)} | ${me.serverCpuMs.toFixed(2)}`,
    );
    print(
      `POST /api/evaluate, 3 standards | 1 | ${small.perSecond.toFixed(0)} | ${small.medianMs.toFixed(2)} | ${small.serverCpuMs.toFixed(2)}`,
    );

    const studies = await send(agent, port, 'GET', '/api/studies', token);
    const firstId = studies.status === 200 ? (JSON.parse(studies.body) as { items: { id: string }[] }).items[0]?.id : undefined;
    if (!firstId) print(`no study to render a report of (GET /api/studies answered ${studies.status})`);
    const heavy: [string, () => Promise<Answer>][] = [
      ['5,000-standard evaluation', () => send(new Agent(), port, 'POST', '/api/evaluate', token, heavyStudy())],
      ...(firstId
        ? ([['validation report draft (render)', () => send(new Agent(), port, 'GET', `/api/studies/${firstId}/report`, token)]] as [
            string,
            () => Promise<Answer>,
          ][])
        : []),
    ];
    print('heavy request | its time ms | slowest health answer meanwhile ms | health answers meanwhile');
    for (const [name, call] of heavy) {
      await healthDuring(port, call);
      const figures = await healthDuring(port, call);
      print(`${name} | ${figures.heavyMs.toFixed(0)} | ${figures.maxHealthMs.toFixed(1)} | ${figures.polls}`);
    }
    agent.destroy();
  } finally {
    child.kill('SIGTERM');
    await new Promise((resolve) => child.once('exit', resolve));
    rmSync(dir, { recursive: true, force: true });
  }
}

if (process.argv[2] === 'serve') await serve();
else await main();
