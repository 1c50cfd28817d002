import { SessionRecord } from './modules/sessions/session.entity';
import { User } from './modules/users/user.entity';

/** Every entity the data source knows; listed explicitly so tsx and the TypeORM CLI load the same set. */
export const entities = [User, SessionRecord];
