import { CreateUsersAndSessions1764604800000 } from '../migrations/1764604800000-create-users-and-sessions';
import { CreateRegistry1796145321705 } from '../migrations/1796145321705-create-registry';

/** Every migration, oldest first. */
export const migrations = [CreateUsersAndSessions1764604800000, CreateRegistry1796145321705];
