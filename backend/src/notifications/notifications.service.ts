import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { IsNull, Repository, type EntityManager } from 'typeorm';
import { Notification } from './notification.entity.js';
import type { NotificationDto, NotificationListDto } from '@meritline/shared';
import type { Notice } from './notifications.types.js';

const LIST_SIZE = 50;
const MESSAGE_LENGTH = 300;

export function toNotificationDto(notification: Notification): NotificationDto {
  return {
    id: notification.id,
    kind: notification.kind,
    message: notification.message,
    link: notification.link,
    readAt: notification.readAt?.toISOString() ?? null,
    createdAt: notification.createdAt.toISOString(),
  };
}

@Injectable()
export class NotificationsService {
  constructor(@InjectRepository(Notification) private readonly notifications: Repository<Notification>) {}

  /** Pass the caller's transaction manager so the notices appear only if the change they announce commits. */
  async notify(userIds: readonly string[], notice: Notice, manager?: EntityManager): Promise<void> {
    const repo = manager?.getRepository(Notification) ?? this.notifications;
    const recipients = [...new Set(userIds)];
    if (!recipients.length) return;
    const message = notice.message.length > MESSAGE_LENGTH ? `${notice.message.slice(0, MESSAGE_LENGTH - 1)}…` : notice.message;
    // Stamped here, to the millisecond, so notices of one second still list newest first.
    const createdAt = new Date();
    await repo.save(
      recipients.map((userId) => repo.create({ userId, kind: notice.kind, message, link: notice.link, readAt: null, createdAt })),
    );
  }

  async listFor(userId: string): Promise<NotificationListDto> {
    const [items, unread] = await Promise.all([
      this.notifications.find({ where: { userId }, order: { createdAt: 'DESC' }, take: LIST_SIZE }),
      this.notifications.countBy({ userId, readAt: IsNull() }),
    ]);
    return { items: items.map(toNotificationDto), unread };
  }

  async markRead(id: string, userId: string): Promise<NotificationDto> {
    const notification = await this.notifications.findOneBy({ id, userId });
    if (!notification) throw new NotFoundException('Notification not found.');
    if (!notification.readAt) {
      notification.readAt = new Date();
      await this.notifications.save(notification);
    }
    return toNotificationDto(notification);
  }

  async markAllRead(userId: string): Promise<{ marked: number }> {
    const result = await this.notifications.update({ userId, readAt: IsNull() }, { readAt: new Date() });
    return { marked: result.affected ?? 0 };
  }
}
