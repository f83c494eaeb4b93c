import { Injectable, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, IsNull, type EntityManager } from 'typeorm';
import type { ColumnMetadata } from 'typeorm/metadata/ColumnMetadata.js';
import { writeTransaction } from '../database/write-transaction.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { User } from '../users/user.entity.js';
import { SessionSettingsService } from './session-settings.service.js';
import { UserSession } from './user-session.entity.js';

export interface TokenPayload {
  sub: string;
  sid?: string;
  ver?: number;
  exp?: number;
}

export type SessionUser = AuthUser & { sessionId: string };

/** What the guard needs of a session and its user, in one indexed read. */
interface SessionRow {
  email: string;
  name: string;
  roles: unknown;
  active: unknown;
  passwordHash: string | null;
  userVersion: number;
  sessionVersion: number;
  endedAt: unknown;
  lastActivityAt: unknown;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const isUuid = (value: unknown): value is string => typeof value === 'string' && UUID.test(value);

export const SESSION_ENDED = 'Your session is no longer valid. Sign in again.';
export const SESSION_IDLE = 'You were signed out after a period without activity. Sign in again.';
// Recording every request would put a write on each read; a coarser mark is enough to judge idleness.
const ACTIVITY_RESOLUTION_MS = 15_000;

@Injectable()
export class SessionsService {
  private readonly sessionQuery: string;
  private readonly lastActivityColumn: ColumnMetadata;
  private readonly rolesColumn: ColumnMetadata;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly settings: SessionSettingsService,
  ) {
    const [sidParam, subParam] = dataSource.options.type === 'postgres' ? ['$1', '$2'] : ['?', '?'];
    this.sessionQuery =
      'SELECT u.email, u.name, u.roles, u.active, u.password_hash AS "passwordHash", u.token_version AS "userVersion", ' +
      's.token_version AS "sessionVersion", s.ended_at AS "endedAt", s.last_activity_at AS "lastActivityAt" ' +
      `FROM user_sessions s JOIN users u ON u.id = s.user_id WHERE s.id = ${sidParam} AND s.user_id = ${subParam}`;
    this.lastActivityColumn = dataSource.getMetadata(UserSession).findColumnWithPropertyName('lastActivityAt') as ColumnMetadata;
    this.rolesColumn = dataSource.getMetadata(User).findColumnWithPropertyName('roles') as ColumnMetadata;
  }

  /** A raw column value as TypeORM would hydrate it on this database (dates on SQLite are text, JSON columns are text). */
  private hydrate(column: ColumnMetadata, value: unknown): unknown {
    return this.dataSource.driver.prepareHydratedValue(value, column);
  }

  async start(user: User): Promise<UserSession> {
    const now = new Date();
    return writeTransaction(this.dataSource, (manager) =>
      manager
        .getRepository(UserSession)
        .save({ userId: user.id, tokenVersion: user.tokenVersion, lastActivityAt: now, endedAt: null, endReason: null }),
    );
  }

  /**
   * The signed-in user of a verified token, read afresh on every request so that sign-out, deactivation, password,
   * role and token-version changes act on the very next one. Refuses tokens without an expiry, from an ended or idle
   * session, or signed before the user's last password change or deactivation.
   */
  async authenticate(payload: TokenPayload): Promise<SessionUser> {
    const { sub, sid, ver, exp } = payload;
    // Ids that cannot be a session's or a user's never reach the database (PostgreSQL would refuse them as uuid).
    if (typeof exp !== 'number' || !isUuid(sid) || !isUuid(sub)) throw new UnauthorizedException(SESSION_ENDED);
    const rows = (await this.dataSource.query(this.sessionQuery, [sid, sub]).catch(() => [])) as SessionRow[];
    const row = rows[0];
    const current =
      row && row.active && row.passwordHash && !row.endedAt && ver === row.userVersion && row.sessionVersion === row.userVersion;
    if (!current) throw new UnauthorizedException(SESSION_ENDED);
    const lastActivityAt = this.hydrate(this.lastActivityColumn, row.lastActivityAt) as Date;
    const now = Date.now();
    const { idleMinutes } = await this.settings.get();
    if (now - lastActivityAt.getTime() > idleMinutes * 60_000) {
      await this.end(sid, 'idle');
      throw new UnauthorizedException(SESSION_IDLE);
    }
    if (now - lastActivityAt.getTime() > ACTIVITY_RESOLUTION_MS) {
      await writeTransaction(this.dataSource, (manager) =>
        manager.getRepository(UserSession).update({ id: sid }, { lastActivityAt: new Date(now) }),
      );
    }
    const roles = this.hydrate(this.rolesColumn, row.roles) as User['roles'];
    return { id: sub, email: row.email, name: row.name, roles, sessionId: sid };
  }

  end(sessionId: string, reason: string): Promise<void> {
    return writeTransaction(this.dataSource, async (manager) => {
      await manager.getRepository(UserSession).update({ id: sessionId, endedAt: IsNull() }, { endedAt: new Date(), endReason: reason });
    });
  }

  /** Inside the caller's transaction, so the sessions end with the change that ends them. */
  static async endAllFor(manager: EntityManager, userId: string, reason: string): Promise<void> {
    await manager.getRepository(UserSession).update({ userId, endedAt: IsNull() }, { endedAt: new Date(), endReason: reason });
  }
}
