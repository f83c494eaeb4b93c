import { Injectable, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, IsNull, type EntityManager } from 'typeorm';
import { writeTransaction } from '../database/write-transaction.js';
import type { User } from '../users/user.entity.js';
import { SessionSettingsService } from './session-settings.service.js';
import { UserSession } from './user-session.entity.js';

export interface TokenPayload {
  sub: string;
  sid?: string;
  ver?: number;
  exp?: number;
}

export const SESSION_ENDED = 'Your session is no longer valid. Sign in again.';
export const SESSION_IDLE = 'You were signed out after a period without activity. Sign in again.';
// Recording every request would put a write on each read; a coarser mark is enough to judge idleness.
const ACTIVITY_RESOLUTION_MS = 15_000;

@Injectable()
export class SessionsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly settings: SessionSettingsService,
  ) {}

  async start(user: User): Promise<UserSession> {
    const now = new Date();
    return writeTransaction(this.dataSource, (manager) =>
      manager
        .getRepository(UserSession)
        .save({ userId: user.id, tokenVersion: user.tokenVersion, lastActivityAt: now, endedAt: null, endReason: null }),
    );
  }

  /** Refuses tokens without an expiry, from an ended or idle session, or signed before the user's last password change or deactivation. */
  async touch(payload: TokenPayload, user: User): Promise<UserSession> {
    if (typeof payload.exp !== 'number' || typeof payload.sid !== 'string' || payload.ver !== user.tokenVersion)
      throw new UnauthorizedException(SESSION_ENDED);
    const repo = this.dataSource.getRepository(UserSession);
    const session = await repo.findOneBy({ id: payload.sid }).catch(() => null);
    if (!session || session.userId !== user.id || session.endedAt || session.tokenVersion !== user.tokenVersion)
      throw new UnauthorizedException(SESSION_ENDED);
    const now = Date.now();
    const { idleMinutes } = await this.settings.get();
    if (now - session.lastActivityAt.getTime() > idleMinutes * 60_000) {
      await this.end(session.id, 'idle');
      throw new UnauthorizedException(SESSION_IDLE);
    }
    if (now - session.lastActivityAt.getTime() > ACTIVITY_RESOLUTION_MS) {
      session.lastActivityAt = new Date(now);
      await writeTransaction(this.dataSource, (manager) =>
        manager.getRepository(UserSession).update({ id: session.id }, { lastActivityAt: session.lastActivityAt }),
      );
    }
    return session;
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
