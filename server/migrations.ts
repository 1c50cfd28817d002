import { CreateUsersAndSessions1764604800000 } from '../migrations/1764604800000-create-users-and-sessions';
import { CreateRegistry1796145321705 } from '../migrations/1796145321705-create-registry';
import { AddUserPreferences1796147746489 } from '../migrations/1796147746489-add-user-preferences';
import { AddRegistryViewIndexes1796148152276 } from '../migrations/1796148152276-add-registry-view-indexes';
import { AddMailAndDigests1796148484832 } from '../migrations/1796148484832-add-mail-and-digests';
import { AddImports1796148927356 } from '../migrations/1796148927356-add-imports';

/** Every migration, oldest first. */
export const migrations = [CreateUsersAndSessions1764604800000, CreateRegistry1796145321705, AddUserPreferences1796147746489, AddRegistryViewIndexes1796148152276, AddMailAndDigests1796148484832, AddImports1796148927356];
