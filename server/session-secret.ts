import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/** The configured session secret, or one generated on first start and kept in the data folder. */
export function loadSessionSecret(dataDir: string, configured?: string): string {
  if (configured) return configured;
  const path = join(dataDir, 'session-secret');
  if (existsSync(path)) return readFileSync(path, 'utf8').trim();
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(path, `${secret}\n`, { mode: 0o600 });
  return secret;
}
