import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { createHash, randomBytes } from 'node:crypto';
import { DataSource, IsNull, Repository } from 'typeorm';
import { Role, type UserDto } from '@meritline/shared';
import type { FieldChanges } from '../audit/audit-entry.entity.js';
import { AuditService, type AuditRecord } from '../audit/audit.service.js';
import { UserSession } from '../auth/user-session.entity.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { MailService } from '../mail/mail.service.js';
import { writeTransaction } from '../database/write-transaction.js';
import type { CreateInvitationDto } from './dto/create-invitation.dto.js';
import type { UpdateUserDto } from './dto/update-user.dto.js';
import { User } from './user.entity.js';

const INVITATION_DAYS = 7;

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function toUserDto(user: User): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    roles: user.roles,
    active: user.active,
    invitationPending: user.passwordHash === null,
    createdAt: user.createdAt.toISOString(),
    lastSignInAt: user.lastSignInAt?.toISOString() ?? null,
  };
}

@Injectable()
export class UsersService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(User) private readonly users: Repository<User>,
    private readonly mail: MailService,
    private readonly audit: AuditService,
  ) {}

  findAll(): Promise<User[]> {
    return this.users.find({ order: { name: 'ASC' } });
  }

  findByEmail(email: string): Promise<User | null> {
    return this.users.findOneBy({ email: email.trim().toLowerCase() });
  }

  async findById(id: User['id']): Promise<User> {
    const user = await this.users.findOneBy({ id });
    if (!user) throw new NotFoundException('User not found.');
    return user;
  }

  findActiveWithRole(role: Role): Promise<User[]> {
    return this.findAll().then((users) => users.filter((user) => user.active && user.roles.includes(role)));
  }

  async invite(dto: CreateInvitationDto, actor: AuthUser): Promise<User> {
    if (await this.findByEmail(dto.email)) {
      throw new ConflictException({
        statusCode: 409,
        message: 'A user with this e-mail already exists.',
        errors: [{ field: 'email', code: 'exists', message: 'A user with this e-mail already exists.' }],
      });
    }
    const token = randomBytes(32).toString('base64url');
    const user = await writeTransaction(this.dataSource, async (manager) => {
      const saved = await manager.getRepository(User).save(
        this.users.create({
          ...dto,
          passwordHash: null,
          active: true,
          invitationTokenHash: hashToken(token),
          invitationExpiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
        }),
      );
      const changes = { email: { from: null, to: saved.email }, roles: { from: null, to: saved.roles } };
      await this.audit.record({ actor, action: 'user.invited', entity: 'user', entityId: saved.id, changes }, manager);
      return saved;
    });
    await this.mail.sendInvitation(user, token, actor.name);
    return user;
  }

  async update(id: User['id'], dto: UpdateUserDto, actor: AuthUser): Promise<User> {
    const user = await this.findById(id);
    if (id === actor.id && (dto.active === false || (dto.roles && !dto.roles.includes(Role.Admin)))) {
      throw new ForbiddenException('You cannot deactivate yourself or remove your own administrator role.');
    }
    if (id === actor.id && dto.roles && JSON.stringify([...dto.roles].sort()) !== JSON.stringify([...user.roles].sort())) {
      throw new ForbiddenException('Another administrator must change the roles of your own account.');
    }
    const changes: FieldChanges = {};
    for (const key of ['name', 'roles', 'active'] as const) {
      if (dto[key] !== undefined && JSON.stringify(dto[key]) !== JSON.stringify(user[key]))
        changes[key] = { from: user[key], to: dto[key] };
    }
    const deactivating = dto.active === false && user.active;
    Object.assign(user, dto);
    // A new token version keeps tokens issued before the deactivation refused after a reactivation.
    if (deactivating) user.tokenVersion += 1;
    return writeTransaction(this.dataSource, async (manager) => {
      const saved = await manager.getRepository(User).save(user);
      if (deactivating)
        await manager
          .getRepository(UserSession)
          .update({ userId: id, endedAt: IsNull() }, { endedAt: new Date(), endReason: 'deactivated' });
      if (Object.keys(changes).length)
        await this.audit.record({ actor, action: 'user.updated', entity: 'user', entityId: id, changes }, manager);
      return saved;
    });
  }

  /** Sets the password of an invited user and records it; null when the link is unknown, used or expired. */
  acceptInvitation(token: string, name: string, passwordHash: string): Promise<User | null> {
    return writeTransaction(this.dataSource, async (manager) => {
      const repo = manager.getRepository(User);
      const user = await repo.findOneBy({ invitationTokenHash: hashToken(token) });
      if (!user || !user.active || !user.invitationExpiresAt || user.invitationExpiresAt < new Date()) return null;
      Object.assign(user, { name, passwordHash, invitationTokenHash: null, invitationExpiresAt: null });
      const saved = await repo.save(user);
      await this.audit.record({ actor: saved, action: 'auth.invitation-accepted', entity: 'user', entityId: saved.id }, manager);
      return saved;
    });
  }

  /** The user holding a one-time link (password reset or unlock), whatever its expiry. */
  findByLinkToken(kind: 'passwordResetTokenHash' | 'unlockTokenHash' | 'invitationTokenHash', token: string): Promise<User | null> {
    return this.users.findOneBy({ [kind]: hashToken(token) });
  }

  /** Saves a change to the user together with its audit entry. */
  saveWithAudit(user: User, record: Omit<AuditRecord, 'entity' | 'entityId'>): Promise<User> {
    return writeTransaction(this.dataSource, async (manager) => {
      const saved = await manager.getRepository(User).save(user);
      await this.audit.record({ ...record, entity: 'user', entityId: user.id }, manager);
      return saved;
    });
  }
}
