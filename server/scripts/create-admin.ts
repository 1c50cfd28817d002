/**
 * `npm run create-admin -- --email you@example.org --name "Your Name"`: creates an admin account on the
 * configured data folder, for installations started with KCATALOG_SEED=none. The password comes from
 * KCATALOG_ADMIN_PASSWORD or is asked for on the terminal.
 */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { createInterface } from 'node:readline/promises';
import { createUserInput } from '@shared/schemas/auth';
import { openDatabase } from '../data-source';
import { parseEnv } from '../env';
import { fieldMessages } from '../http/validate';
import { createUser } from '../modules/users/users.service';

const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } } });
const password =
  process.env.KCATALOG_ADMIN_PASSWORD ??
  (await createInterface({ input: process.stdin, output: process.stdout }).question('Password (at least 10 characters): '));

const input = createUserInput.safeParse({ email: values.email, name: values.name, role: 'admin', password });
if (!input.success) {
  for (const [field, message] of Object.entries(fieldMessages(input.error))) console.error(`${field}: ${message}`);
  process.exit(1);
}

const env = parseEnv();
mkdirSync(env.dataDir, { recursive: true });
const dataSource = await openDatabase({ database: join(env.dataDir, 'kcatalog.sqlite') });
try {
  const user = await createUser(dataSource, input.data);
  console.log(`Created admin ${user.email}.`);
} finally {
  await dataSource.destroy();
}
