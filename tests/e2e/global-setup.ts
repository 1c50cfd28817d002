import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { TestProject } from 'vitest/node';
import { chromiumMissingHint, findChromium } from './chromium';
import { freePort } from '../free-port';

const rootDir = resolve(import.meta.dirname, '../..');

async function waitForHealth(url: string, server: ChildProcess, timeoutMs = 120_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`The server exited with code ${server.exitCode} before it was ready.`);
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((done) => setTimeout(done, 250));
  }
  throw new Error(`The server did not answer ${url}/api/health within ${timeoutMs / 1000} s.`);
}

/**
 * Starts the real server (`npm start`'s entry: builds the client if needed, migrates, seeds the demo)
 * on a fresh data folder, and hands its address to the browser tests.
 */
export default async function setup(project: TestProject) {
  const chromiumPath = findChromium();
  project.provide('chromiumPath', chromiumPath ?? '');
  if (!chromiumPath) {
    console.warn(chromiumMissingHint);
    project.provide('baseUrl', '');
    return;
  }
  const dataDir = mkdtempSync(join(tmpdir(), 'kcatalog-e2e-'));
  const port = process.env.KCATALOG_E2E_PORT ? Number(process.env.KCATALOG_E2E_PORT) : await freePort();
  const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: rootDir,
    env: { ...process.env, PORT: String(port), KCATALOG_DATA_DIR: dataDir, KCATALOG_SEED: 'demo', KCATALOG_HOST: '127.0.0.1' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  server.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  server.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const baseUrl = `http://127.0.0.1:${port}`;
  try {
    await waitForHealth(baseUrl, server);
  } catch (error) {
    server.kill('SIGKILL');
    throw new Error(`${(error as Error).message}\n${output}`);
  }
  project.provide('baseUrl', baseUrl);

  return async () => {
    server.kill('SIGTERM');
    await new Promise((done) => server.once('exit', done));
    rmSync(dataDir, { recursive: true, force: true });
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    chromiumPath: string;
  }
}
