import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { createApp } from '@server/app';
import { openDatabase } from '@server/data-source';
import type { DatabaseSessionStore } from '@server/modules/sessions/database-session-store';
import { demoPassword, seedDemoAccounts } from '@server/seed/demo-accounts';

export const testSecret = 'test-session-secret-that-is-long-enough-0123456789';

export interface TestApp {
  app: Express;
  dataSource: DataSource;
  dataDir: string;
  close: () => Promise<void>;
}

/** An app on a fresh SQLite file in a temporary folder, migrated, with the demo accounts (not the demo campaign). */
export async function createTestApp(dataDir = mkdtempSync(join(tmpdir(), 'kcatalog-test-'))): Promise<TestApp> {
  const dataSource = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
  if ((await dataSource.query('SELECT COUNT(*) AS n FROM users'))[0].n === 0) await seedDemoAccounts(dataSource);
  const app = createApp(dataSource, { sessionSecret: testSecret, dataDir });
  return {
    app,
    dataSource,
    dataDir,
    close: async () => {
      (app.locals.sessionStore as DatabaseSessionStore).close();
      await dataSource.destroy();
    },
  };
}

export function removeDataDir(dataDir: string): void {
  rmSync(dataDir, { recursive: true, force: true });
}

/** A cookie-keeping client that has fetched its CSRF token. */
export async function client(app: Express) {
  const agent = request.agent(app);
  const { body } = await agent.get('/api/auth/csrf').expect(200);
  let csrfToken = body.csrfToken as string;
  return {
    agent,
    get csrfToken() {
      return csrfToken;
    },
    set csrfToken(token: string) {
      csrfToken = token;
    },
  };
}

/** A client signed in as the demo account of the given role (or any e-mail and password). */
export async function signedIn(app: Express, email: string, password = demoPassword) {
  const session = await client(app);
  const response = await session.agent
    .post('/api/auth/sign-in')
    .set('X-CSRF-Token', session.csrfToken)
    .send({ email, password })
    .expect(200);
  session.csrfToken = response.body.csrfToken as string;
  return Object.assign(session, { cookie: sessionCookie(response) ?? '' });
}

export const demoEmail = (role: string) => `${role}@kcatalog.example`;

/** The value of the session cookie a response set, if any. */
export function sessionCookie(response: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
  return cookies.find((cookie) => cookie.startsWith('kcatalog.sid='))?.split(';')[0];
}
