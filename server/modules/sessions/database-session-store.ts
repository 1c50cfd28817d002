import session from 'express-session';
import { LessThan, type DataSource, type Repository } from 'typeorm';
import { preparedRead } from '../../sqlite-statement';
import { SessionRecord } from './session.entity';

const defaultLifetimeMs = 7 * 24 * 60 * 60 * 1000;
const pruneIntervalMs = 15 * 60 * 1000;
// A rolling session's expiry moves on every request; writing it more often than this buys nothing
// over a week-long lifetime and would make every read request a database write.
const touchIntervalMs = 10 * 60 * 1000;
const maxTrackedSessions = 10_000;
const selectSession = preparedRead<{ data: string; expiresAt: number }>(`SELECT "data", "expires_at" AS "expiresAt" FROM "sessions" WHERE "sid" = ?`);

type Callback<T = void> = (error?: unknown, value?: T) => void;

/**
 * express-session store on the application's own database. Written here because the packaged SQLite
 * stores either keep Node from exiting or need an older TypeORM. Expired rows are pruned on a timer
 * that does not hold the process open.
 */
export class DatabaseSessionStore extends session.Store {
  private readonly repository: Repository<SessionRecord>;
  private readonly pruneTimer: NodeJS.Timeout;
  private readonly lastTouched = new Map<string, number>();

  constructor(private readonly dataSource: DataSource) {
    super();
    this.repository = dataSource.getRepository(SessionRecord);
    this.pruneTimer = setInterval(() => void this.prune(), pruneIntervalMs);
    this.pruneTimer.unref();
  }

  // Read on every signed-in request, so through a prepared statement rather than the ORM.
  override get = (sid: string, callback: Callback<session.SessionData | null>) => {
    let record: { data: string; expiresAt: number } | undefined;
    try {
      record = selectSession(this.dataSource, sid);
    } catch (error) {
      return callback(error);
    }
    if (!record || record.expiresAt <= Date.now()) return callback(undefined, null);
    callback(undefined, JSON.parse(record.data) as session.SessionData);
  };

  override set = (sid: string, data: session.SessionData, callback?: Callback) => {
    this.repository
      .save(this.toRecord(sid, data))
      .then(() => callback?.())
      .catch((error: unknown) => callback?.(error));
  };

  override touch = (sid: string, data: session.SessionData, callback?: Callback) => {
    const now = Date.now();
    if (now - (this.lastTouched.get(sid) ?? 0) < touchIntervalMs) {
      callback?.();
      return;
    }
    if (this.lastTouched.size >= maxTrackedSessions) this.lastTouched.clear();
    this.lastTouched.set(sid, now);
    this.repository
      .update({ sid }, { expiresAt: expiryOf(data) })
      .then(() => callback?.())
      .catch((error: unknown) => callback?.(error));
  };

  override destroy = (sid: string, callback?: Callback) => {
    this.lastTouched.delete(sid);
    this.repository
      .delete({ sid })
      .then(() => callback?.())
      .catch((error: unknown) => callback?.(error));
  };

  /** Ends every session of a user (deactivation, password change). */
  async destroyAllForUser(userId: number): Promise<void> {
    await this.repository.delete({ userId });
    this.lastTouched.clear();
  }

  /** Stops the prune timer (tests, shutdown). */
  close(): void {
    clearInterval(this.pruneTimer);
  }

  private async prune(): Promise<void> {
    await this.repository.delete({ expiresAt: LessThan(Date.now()) }).catch(() => undefined);
  }

  private toRecord(sid: string, data: session.SessionData): SessionRecord {
    const record = new SessionRecord();
    record.sid = sid;
    record.data = JSON.stringify(data);
    record.expiresAt = expiryOf(data);
    record.userId = userIdOf(data);
    return record;
  }
}

function expiryOf(data: session.SessionData): number {
  const expires = data.cookie?.expires;
  return expires ? new Date(expires).getTime() : Date.now() + defaultLifetimeMs;
}

function userIdOf(data: session.SessionData): number | null {
  const passportUser = (data as { passport?: { user?: unknown } }).passport?.user;
  return typeof passportUser === 'number' ? passportUser : null;
}
