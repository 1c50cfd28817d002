import type { DataSource } from 'typeorm';
import type { CreateUserInput, SessionUserDto, UpdateUserInput, UserDto, UserPreferences } from '@shared/schemas/auth';
import { badRequest, conflict, notFound, staleVersion } from '../../http/errors';
import { preparedRead } from '../../sqlite-statement';
import { hashPassword, verifyPassword } from './password';
import { User } from './user.entity';

export function toUserDto(user: User): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
    version: user.version,
  };
}

export function toSessionUser(user: User): SessionUserDto {
  return { id: user.id, email: user.email, name: user.name, role: user.role, preferences: user.preferences ?? {} };
}

/** Merges display preferences into the user's stored ones; not versioned, the last choice wins. */
export async function updatePreferences(dataSource: DataSource, userId: number, changes: UserPreferences): Promise<UserPreferences> {
  const repository = dataSource.getRepository(User);
  const user = await repository.findOneBy({ id: userId });
  if (!user) throw notFound('The user');
  const preferences = { ...user.preferences, ...changes };
  await dataSource.query(`UPDATE "users" SET "preferences" = ? WHERE "id" = ?`, [JSON.stringify(preferences), userId]);
  return preferences;
}

// A real hash of a random password, so unknown e-mail addresses cost the same time as wrong passwords.
const decoyHash = hashPassword(`decoy-${Math.random()}`);

/** Checks credentials; inactive accounts fail exactly like wrong passwords. */
export async function authenticate(dataSource: DataSource, email: string, password: string): Promise<User | null> {
  const user = await dataSource.getRepository(User).findOneBy({ email: email.toLowerCase() });
  if (!user) {
    await verifyPassword(password, await decoyHash);
    return null;
  }
  const matches = await verifyPassword(password, user.passwordHash);
  return matches && user.active ? user : null;
}

export async function recordSignIn(dataSource: DataSource, userId: number): Promise<void> {
  // A plain UPDATE so a sign-in does not bump the optimistic-lock version an admin may be editing.
  await dataSource.query(`UPDATE "users" SET "last_sign_in_at" = ? WHERE "id" = ?`, [new Date().toISOString(), userId]);
}

const selectActiveUser = preparedRead<{ id: number; email: string; name: string; role: SessionUserDto['role']; preferences: string }>(
  `SELECT "id", "email", "name", "role", "preferences" FROM "users" WHERE "id" = ? AND "active" = 1`,
);

/**
 * The signed-in user for a session, or null when the account is gone or deactivated. Runs on every
 * signed-in request, so it is a prepared statement rather than an entity load.
 */
export async function findActiveSessionUser(dataSource: DataSource, id: number): Promise<SessionUserDto | null> {
  const row = selectActiveUser(dataSource, id);
  return row ? { id: row.id, email: row.email, name: row.name, role: row.role, preferences: JSON.parse(row.preferences) as UserPreferences } : null;
}

export async function listUsers(dataSource: DataSource): Promise<UserDto[]> {
  const users = await dataSource.getRepository(User).find({ order: { name: 'ASC' } });
  return users.map(toUserDto);
}

export async function createUser(dataSource: DataSource, input: CreateUserInput): Promise<UserDto> {
  const repository = dataSource.getRepository(User);
  if (await repository.existsBy({ email: input.email })) {
    throw conflict(`A user with the e-mail address ${input.email} already exists.`);
  }
  const user = repository.create({
    email: input.email,
    name: input.name,
    role: input.role,
    passwordHash: await hashPassword(input.password),
    active: true,
    lastSignInAt: null,
  });
  return toUserDto(await repository.save(user));
}

/** Applies an admin's change to a user, refusing a stale version. */
export async function updateUser(
  dataSource: DataSource,
  actorId: number,
  id: number,
  input: UpdateUserInput,
): Promise<UserDto> {
  // An admin who demoted or deactivated themselves could leave the installation with nobody to run it.
  if (id === actorId && (input.active === false || (input.role !== undefined && input.role !== 'admin'))) {
    throw badRequest('You cannot deactivate your own account or give up your own admin role.', {
      [input.active === false ? 'active' : 'role']: 'cannot be changed on your own account',
    });
  }
  return dataSource.transaction(async (manager) => {
    const repository = manager.getRepository(User);
    const user = await repository.findOneBy({ id });
    if (!user) throw notFound('The user');
    if (user.version !== input.version) throw staleVersion('This user', user.version);
    if (input.role !== undefined) user.role = input.role;
    if (input.active !== undefined) user.active = input.active;
    if (input.name !== undefined) user.name = input.name;
    return toUserDto(await repository.save(user));
  });
}

/** Changes a user's own password after checking the current one. */
export async function changePassword(
  dataSource: DataSource,
  userId: number,
  currentPassword: string,
  newPassword: string,
): Promise<void> {
  const repository = dataSource.getRepository(User);
  const user = await repository.findOneBy({ id: userId });
  if (!user) throw notFound('The user');
  if (!(await verifyPassword(currentPassword, user.passwordHash))) {
    throw badRequest('The current password is not correct.', { currentPassword: 'is not correct' });
  }
  user.passwordHash = await hashPassword(newPassword);
  await repository.save(user);
}
