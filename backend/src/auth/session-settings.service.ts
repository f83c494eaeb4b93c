import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { SessionSettingsDto } from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { writeTransaction } from '../database/write-transaction.js';
import { AppSetting } from './app-setting.entity.js';

const IDLE_KEY = 'session.idle-minutes';
export const DEFAULT_IDLE_MINUTES = 30;

@Injectable()
export class SessionSettingsService {
  private cached: SessionSettingsDto | null = null;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  async get(): Promise<SessionSettingsDto> {
    if (this.cached) return this.cached;
    const row = await this.dataSource.getRepository(AppSetting).findOneBy({ key: IDLE_KEY });
    this.cached = { idleMinutes: row ? Number(row.value) : DEFAULT_IDLE_MINUTES };
    return this.cached;
  }

  async update(settings: SessionSettingsDto, actor: AuthUser): Promise<SessionSettingsDto> {
    const before = await this.get();
    await writeTransaction(this.dataSource, async (manager) => {
      await manager.getRepository(AppSetting).save({ key: IDLE_KEY, value: String(settings.idleMinutes) });
      if (before.idleMinutes !== settings.idleMinutes) {
        const changes = { idleMinutes: { from: before.idleMinutes, to: settings.idleMinutes } };
        await this.audit.record({ actor, action: 'settings.session-updated', entity: 'settings', entityId: null, changes }, manager);
      }
    });
    this.cached = { idleMinutes: settings.idleMinutes };
    return this.cached;
  }
}
