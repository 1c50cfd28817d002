import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { createApp } from './app';
import { ensureClientBuilt } from './client-build';
import { openDatabase } from './data-source';
import { parseEnv } from './env';
import { DigestScheduler } from './modules/digests/digest-scheduler';
import { stopSheetReader } from './modules/imports/sheet-reader';
import { startMail } from './modules/mail/start-mail';
import { demoAccounts, demoPassword } from './seed/demo-accounts';
import { seedDemoIfEmpty } from './seed/seed';
import { loadSessionSecret } from './session-secret';

const rootDir = resolve(import.meta.dirname, '..');
const clientDir = join(rootDir, 'dist', 'client');

const env = parseEnv();
mkdirSync(env.dataDir, { recursive: true });
const databasePath = join(env.dataDir, 'kcatalog.sqlite');

const serveClient = process.argv.includes('--api-only') === false;
if (serveClient) await ensureClientBuilt(rootDir, clientDir);

const dataSource = await openDatabase({ database: databasePath });
const seeded = env.KCATALOG_SEED === 'demo' ? await seedDemoIfEmpty(dataSource) : false;
const mail = await startMail(dataSource, env);
const digests = new DigestScheduler(dataSource, mail.options);
await digests.start();

const app = createApp(dataSource, {
  sessionSecret: loadSessionSecret(env.dataDir, env.KCATALOG_SESSION_SECRET),
  trustProxy: env.KCATALOG_TRUST_PROXY,
  clientDir: serveClient ? clientDir : undefined,
  dataDir: env.dataDir,
  mail: mail.options,
});

const server = app.listen(env.PORT, env.KCATALOG_HOST, () => {
  console.log(`Kcatalog is running at http://localhost:${env.PORT}`);
  console.log(`Data: ${databasePath}${seeded ? ' (demo data seeded)' : ''}`);
  console.log(mail.description);
  if (env.KCATALOG_SEED === 'demo') {
    console.log(`Demo accounts (password "${demoPassword}"):`);
    for (const account of demoAccounts) console.log(`  ${account.role.padEnd(10)} ${account.email}`);
  }
});

function shutDown(): void {
  server.close(() => {
    void digests
      .stop()
      .then(() => mail.close())
      .then(() => stopSheetReader())
      .then(() => dataSource.destroy())
      .finally(() => process.exit(0));
  });
}
process.on('SIGINT', shutDown);
process.on('SIGTERM', shutDown);
