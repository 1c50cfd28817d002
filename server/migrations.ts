import { CreateUsersAndSessions1764604800000 } from '../migrations/1764604800000-create-users-and-sessions';

/** Every migration, oldest first. */
export const migrations = [CreateUsersAndSessions1764604800000];
