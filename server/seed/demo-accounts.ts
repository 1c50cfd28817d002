import { In, type DataSource } from 'typeorm';
import type { Role } from '@shared/auth/permissions';
import { hashPassword } from '../modules/users/password';
import { User } from '../modules/users/user.entity';

/** The shared password of every demo account (printed at start and shown on the sign-in page). */
export const demoPassword = 'kcatalog-demo';

/** One invented account per role; the people are fictional. */
export const demoAccounts: readonly { email: string; name: string; role: Role }[] = [
  { email: 'admin@kcatalog.example', name: 'Ines Okafor-Lind', role: 'admin' },
  { email: 'lead@kcatalog.example', name: 'Tomas Varga-Reyes', role: 'lead' },
  { email: 'kineticist@kcatalog.example', name: 'Mira Halvorsen', role: 'kineticist' },
  { email: 'biologist@kcatalog.example', name: 'Daniel Achterberg', role: 'biologist' },
  { email: 'viewer@kcatalog.example', name: 'Sofia Brennan-Ito', role: 'viewer' },
];

/** Creates the demo accounts; the caller decides that the database is empty. */
export async function seedDemoAccounts(dataSource: DataSource): Promise<void> {
  const passwordHash = await hashPassword(demoPassword);
  const repository = dataSource.getRepository(User);
  await repository.save(
    demoAccounts.map((account) => repository.create({ ...account, passwordHash, active: true, lastSignInAt: null })),
  );
}

/** The demo accounts that still exist and are active, for the sign-in page's hint. */
export async function existingDemoAccounts(dataSource: DataSource): Promise<{ email: string; role: Role }[]> {
  const users = await dataSource
    .getRepository(User)
    .findBy({ email: In(demoAccounts.map((account) => account.email)), active: true });
  return demoAccounts.filter((account) => users.some((user) => user.email === account.email)).map(({ email, role }) => ({ email, role }));
}
