import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

const clientSources = ['src', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts'];

function newestModification(path: string): number {
  const stats = statSync(path);
  if (!stats.isDirectory()) return stats.mtimeMs;
  return readdirSync(path).reduce((newest, entry) => Math.max(newest, newestModification(join(path, entry))), stats.mtimeMs);
}

/**
 * Builds the client with Vite when dist/client is missing or older than its sources, so
 * `npm start` on a fresh clone serves a current client without a separate build step.
 */
export async function ensureClientBuilt(rootDir: string, clientDir: string): Promise<void> {
  const indexPath = join(clientDir, 'index.html');
  if (existsSync(indexPath)) {
    const builtAt = statSync(indexPath).mtimeMs;
    const sourcesAt = Math.max(...clientSources.map((source) => join(rootDir, source)).filter(existsSync).map(newestModification));
    if (builtAt >= sourcesAt) return;
  }
  console.log('Building the client (first start or changed sources)…');
  const { build } = await import('vite');
  // Always the production build: under a test runner NODE_ENV is `test`, and Vite then bundles React's
  // development build (slower, StrictMode effects run twice), which is not what the server should serve.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({ root: rootDir, configFile: join(rootDir, 'vite.config.ts'), logLevel: 'warn' });
  } finally {
    if (nodeEnv === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = nodeEnv;
  }
}
