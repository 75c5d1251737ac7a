// REST API load figures: prints, asserts nothing. Starts the server (dist/server when built, else the
// sources through tsx) on a temporary database with rate limits off, signs in as a bench admin and
// drives it with autocannon: GET /api/health, POST /api/v1/locus on a degree-8 plant, and
// GET /api/v1/models/{id}/locus (served from the in-memory locus cache). Samples the server's resident memory
// (compute workers included) every second, and at start and end after a forced settle (GC on SIGUSR2). Targets
// (issue 3): compute ≥ 30 % of health throughput with p99 < 50 ms and no errors; cached ≥ 70 %; memory flat.
// BENCH_SECONDS (default 20), BENCH_CONNECTIONS (default 10) and COMPUTE_WORKERS tune it.
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const seconds = Number(process.env.BENCH_SECONDS ?? 20);
const connections = Number(process.env.BENCH_CONNECTIONS ?? 10);
// a degree-8 loop of our own: two real zeros, eight poles (one integrator, three real, two lightly damped pairs)
const DEGREE_8 = { plant: { expression: '(s+1)*(s+3)/(s*(s+2)*(s+4)*(s+5)*(s^2+2*s+10)*(s^2+s+30))' } };

function freePort() {
  return new Promise((done, fail) => {
    const probe = createServer();
    probe.once('error', fail);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address();
      probe.close(() => done(port));
    });
  });
}

function residentMb(pid) {
  try {
    const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'));
    return line ? Number(line.split(/\s+/)[1]) / 1024 : NaN;
  } catch {
    return NaN;
  }
}

async function main() {
  const folder = mkdtempSync(join(tmpdir(), 'polewright-bench-'));
  const port = await freePort();
  // the sources through tsx by default (always current; the same code once loaded), dist/server with BENCH_SERVER=dist
  const built = join(root, 'dist', 'server', 'main.js');
  const useBuilt = process.env.BENCH_SERVER === 'dist';
  if (useBuilt && !existsSync(built)) throw new Error('dist/server/main.js is missing: npm run build:server first');
  // --expose-gc: main.ts then collects garbage on SIGUSR2, for the settled memory figures
  const args = useBuilt ? ['--expose-gc', built] : ['--expose-gc', '--import', 'tsx', join(root, 'server', 'src', 'main.ts')];
  const email = 'bench-admin@polewright.example';
  const password = randomBytes(18).toString('base64url');
  const env = { ...process.env, PORT: String(port), DATABASE_PATH: join(folder, 'bench.sqlite'), RATE_LIMIT_PER_MINUTE: '0', POLEWRIGHT_QUIET: '1', NODE_ENV: 'production', KEY_EXPIRY_CHECK_MS: '0', POLEWRIGHT_ADMIN_EMAIL: email, POLEWRIGHT_ADMIN_PASSWORD: password, POLEWRIGHT_DEMO: 'on' };
  const server = spawn(process.execPath, args, { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });
  const base = `http://127.0.0.1:${port}`;
  try {
    for (let i = 0; ; i++) {
      if (server.exitCode !== null) throw new Error('the server exited during start-up');
      try {
        if ((await fetch(`${base}/api/health`)).ok) break;
      } catch {
        // not listening yet
      }
      if (i > 600) throw new Error('the server did not come up within 60 s');
      await new Promise((r) => setTimeout(r, 100));
    }
    const session = await (await fetch(`${base}/api/v1/sessions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) })).json();
    if (!session.token) throw new Error(`could not sign in as the bench admin: ${JSON.stringify(session)}`);
    const auth = { authorization: `Bearer ${session.token}` };
    const page = await (await fetch(`${base}/api/v1/models?sort=name&pageSize=1`, { headers: auth })).json();
    const modelId = page.items?.[0]?.id;
    if (!modelId) throw new Error('no demo model to read the cached locus of');
    const warm = await fetch(`${base}/api/v1/models/${modelId}/locus`, { headers: auth });
    const cachedBytes = (await warm.text()).length;

    // memory: sampled every second; start and end are taken after a forced settle (GC on SIGUSR2, 2 s idle)
    const settle = async () => {
      server.kill('SIGUSR2');
      await new Promise((r) => setTimeout(r, 2000));
      return residentMb(server.pid);
    };
    const settledStart = await settle();
    const memory = [];
    const sampler = setInterval(() => memory.push(residentMb(server.pid)), 1000);
    memory.push(residentMb(server.pid));
    const run = async (title, options) => {
      const from = memory.length;
      const r = await autocannon({ url: `${base}${options.path}`, connections, duration: seconds, method: options.method ?? 'GET', body: options.body, headers: options.headers ?? {} });
      const during = memory.slice(from).filter(Number.isFinite);
      return { title, r, rss: during.length ? { max: Math.max(...during), end: during.at(-1) } : null };
    };
    const results = [];
    // health as its callers use it (no token); the other two carry the session token they need
    results.push(await run('GET /api/health (no token)', { path: '/api/health' }));
    // reference: the cost of token resolution alone (bearer strategy + session and user look-ups), small body
    results.push(await run('GET /api/v1/me (token, reference)', { path: '/api/v1/me', headers: auth }));
    results.push(await run('POST /api/v1/locus (degree 8)', { path: '/api/v1/locus', method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify(DEGREE_8) }));
    results.push(await run(`GET /api/v1/models/{id}/locus (cached, ${Math.round(cachedBytes / 1024)} KB)`, { path: `/api/v1/models/${modelId}/locus`, headers: auth }));
    clearInterval(sampler);
    memory.push(residentMb(server.pid));
    const settledEnd = await settle();

    console.log(`\nPolewright API load: ${seconds} s per route, ${connections} connections, ${useBuilt ? 'dist/server' : 'tsx sources'}, node ${process.version}`);
    console.log('route'.padEnd(52) + 'req/s'.padStart(9) + 'p50 ms'.padStart(9) + 'p99 ms'.padStart(9) + 'errors'.padStart(9) + '  RSS max/end MB');
    for (const { title, r, rss } of results) {
      // autocannon counts timeouts among its errors already; non-2xx answers are errors here too
      const errors = r.errors + r.non2xx;
      console.log(title.padEnd(52) + r.requests.average.toFixed(0).padStart(9) + String(r.latency.p50).padStart(9) + String(r.latency.p99).padStart(9) + String(errors).padStart(9) + (rss ? `  ${rss.max.toFixed(0)}/${rss.end.toFixed(0)}` : ''));
    }
    const [health, me, compute, cached] = results.map((x) => x.r.requests.average);
    console.log(`compute/health ${(100 * compute / health).toFixed(1)} % (target ≥ 30 %, p99 < 50 ms, 0 errors); cached/health ${(100 * cached / health).toFixed(1)} % (target ≥ 70 %); token-only reference /me is ${(100 * me / health).toFixed(1)} % of health`);
    const finite = memory.filter(Number.isFinite);
    if (finite.length) {
      console.log(`server resident memory (every 1 s, compute workers included): start ${finite[0].toFixed(1)} MB, end ${finite.at(-1).toFixed(1)} MB, max ${Math.max(...finite).toFixed(1)} MB (${finite.length} samples)`);
    }
    console.log(`after a forced settle (GC, 2 s idle): start ${settledStart.toFixed(1)} MB, end ${settledEnd.toFixed(1)} MB, end − start ${(settledEnd - settledStart >= 0 ? '+' : '') + (settledEnd - settledStart).toFixed(1)} MB`);
  } finally {
    server.kill('SIGTERM');
    await new Promise((r) => (server.exitCode !== null ? r() : server.once('exit', r)));
    rmSync(folder, { recursive: true, force: true });
  }
}

main().catch((error) => {
  console.error(`bench-api: ${error.message}`);
  process.exit(1);
});
