import { spawn, type ChildProcess } from 'node:child_process';
import { join, resolve } from 'node:path';
import { ensureClientBuilt } from '../../server/client-build';

const rootDir = resolve(import.meta.dirname, '../..');

export interface RunningServer {
  baseUrl: string;
  stop: () => Promise<void>;
}

export interface StartServerOptions {
  /**
   * Serve the built client too, as `npm start` does (for a benchmark in the browser). The client is built
   * here first when its sources changed, so the server starts within the health deadline.
   */
  serveClient?: boolean;
}

/** Starts the API (by default without the client) on a data folder and waits until /api/health answers. */
export async function startServer(dataDir: string, port: number, options: StartServerOptions = {}): Promise<RunningServer> {
  if (options.serveClient) await ensureClientBuilt(rootDir, join(rootDir, 'dist', 'client'));
  // BENCH_SERVER_NODE_ARGS passes Node flags to the server only, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof".
  const nodeArguments = (process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const serverArguments = [...nodeArguments, '--import', 'tsx', 'server/index.ts', ...(options.serveClient ? [] : ['--api-only'])];
  const server: ChildProcess = spawn(process.execPath, serverArguments, {
    cwd: rootDir,
    env: { ...process.env, PORT: String(port), KCATALOG_DATA_DIR: dataDir, KCATALOG_SEED: 'none', KCATALOG_HOST: '127.0.0.1', NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`server exited with code ${server.exitCode}`);
    const healthy = await fetch(`${baseUrl}/api/health`).then((response) => response.ok).catch(() => false);
    if (healthy) {
      return {
        baseUrl,
        stop: async () => {
          server.kill('SIGTERM');
          await new Promise((done) => server.once('exit', done));
        },
      };
    }
    await new Promise((done) => setTimeout(done, 200));
  }
  server.kill('SIGKILL');
  throw new Error('server did not become healthy within 60 s');
}

/** Signs in through the API and returns the Cookie header for later requests. */
export async function signInCookie(baseUrl: string, email: string, password: string): Promise<string> {
  const csrfResponse = await fetch(`${baseUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrfResponse.json()) as { csrfToken: string };
  const firstCookie = (csrfResponse.headers.get('set-cookie') ?? '').split(';')[0];
  const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken, Cookie: firstCookie },
    body: JSON.stringify({ email, password }),
  });
  if (!signIn.ok) throw new Error(`sign-in failed: ${signIn.status} ${await signIn.text()}`);
  return (signIn.headers.get('set-cookie') ?? '').split(';')[0];
}
