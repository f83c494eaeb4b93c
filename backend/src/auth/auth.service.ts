import { BadRequestException, Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import { InjectDataSource } from '@nestjs/typeorm';
import bcrypt from 'bcryptjs';
import { randomBytes } from 'node:crypto';
import { DataSource } from 'typeorm';
import type { LoginResponse } from '@meritline/shared';
import { AuditService, type AuditRecord } from '../audit/audit.service.js';
import { unprocessable } from '../common/validation.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { writeTransaction } from '../database/write-transaction.js';
import { MailService } from '../mail/mail.service.js';
import type { User } from '../users/user.entity.js';
import { hashToken, UsersService } from '../users/users.service.js';
import type { AcceptInvitationDto } from './dto/accept-invitation.dto.js';
import type { ChangePasswordDto } from './dto/change-password.dto.js';
import type { LoginDto } from './dto/login.dto.js';
import type { PasswordResetConfirmDto } from './dto/password-reset.dto.js';
import { LoginAttemptsService } from './login-attempts.service.js';
import { PasswordPolicyService } from './password-policy.service.js';
import { SessionsService } from './sessions.service.js';

const BCRYPT_ROUNDS = 10;
const BAD_CREDENTIALS = 'E-mail or password is incorrect.';
// Compared against when the account does not exist, so both failures take the same time.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', BCRYPT_ROUNDS);
export const LINK_MINUTES = 30;
export const PASSWORD_RESET_ANSWER = {
  message: 'If an account exists for this address, a link to set a new password is on its way. It is valid for 30 minutes.',
};

@Injectable()
export class AuthService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
    private readonly usersService: UsersService,
    private readonly jwt: JwtService,
    private readonly attempts: LoginAttemptsService,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly policy: PasswordPolicyService,
    private readonly sessions: SessionsService,
  ) {}

  async login(dto: LoginDto, address: string): Promise<LoginResponse> {
    this.attempts.assertAllowed(dto.email, address);
    const user = await this.usersService.findByEmail(dto.email);
    const valid = await bcrypt.compare(dto.password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !user.passwordHash || !valid || !user.active) {
      const locked = this.attempts.recordFailure(dto.email, address);
      await this.audit.record({
        actor: { id: user?.id ?? null, name: dto.email.slice(0, 254) },
        action: 'auth.sign-in-failed',
        entity: 'user',
        entityId: user?.id ?? null,
        reason: `from ${address}`,
      });
      if (locked && user?.active && user.passwordHash) await this.sendUnlockLink(user, 'auth.sign-in-locked');
      throw new UnauthorizedException(BAD_CREDENTIALS);
    }
    user.lastSignInAt = new Date();
    await this.usersService.saveWithAudit(user, { actor: user, action: 'auth.signed-in', reason: `from ${address}` });
    return this.session(user);
  }

  async logout(actor: AuthUser, sessionId: string): Promise<void> {
    await writeTransaction(this.dataSource, async (manager) => {
      await this.sessions.end(sessionId, 'signed-out');
      await this.audit.record({ actor, action: 'auth.signed-out', entity: 'user', entityId: actor.id }, manager);
    });
  }

  /** Re-entry of the password for an electronic signature, throttled per account like sign-in. */
  async verifyPassword(userId: string, password: string): Promise<boolean> {
    this.attempts.assertSigningAllowed(userId);
    const user = await this.usersService.findById(userId);
    const valid = !!user.passwordHash && (await bcrypt.compare(password, user.passwordHash));
    if (!valid && this.attempts.recordSigningFailure(userId)) await this.sendUnlockLink(user, 'signature.locked');
    return valid;
  }

  async changePassword(actor: AuthUser, dto: ChangePasswordDto): Promise<void> {
    const user = await this.usersService.findById(actor.id);
    if (!user.passwordHash || !(await bcrypt.compare(dto.currentPassword, user.passwordHash))) {
      throw unprocessable([{ field: 'currentPassword', code: 'incorrect', message: 'The current password is not correct.' }]);
    }
    this.policy.assertAllowed(dto.newPassword, user.email, 'newPassword');
    await this.setPassword(user, dto.newPassword, { actor, action: 'auth.password-changed' });
  }

  async acceptInvitation(dto: AcceptInvitationDto): Promise<LoginResponse> {
    const invited = await this.usersService.findByLinkToken('invitationTokenHash', dto.token);
    if (invited) this.policy.assertAllowed(dto.password, invited.email);
    const passwordHash = await bcrypt.hash(dto.password, BCRYPT_ROUNDS);
    const user = await this.usersService.acceptInvitation(dto.token, dto.name.trim(), passwordHash);
    if (!user) throw new BadRequestException('This invitation link is not valid or has expired. Ask an administrator for a new one.');
    return this.session(user);
  }

  /** Same answer whether or not the address belongs to an account, so the form tells nobody who has one. */
  async requestPasswordReset(email: string): Promise<typeof PASSWORD_RESET_ANSWER> {
    const user = await this.usersService.findByEmail(email);
    if (!user || !user.active || !user.passwordHash) return PASSWORD_RESET_ANSWER;
    const token = randomBytes(32).toString('base64url');
    user.passwordResetTokenHash = hashToken(token);
    user.passwordResetExpiresAt = new Date(Date.now() + LINK_MINUTES * 60_000);
    await this.usersService.saveWithAudit(user, { actor: { id: null, name: user.email }, action: 'auth.password-reset-requested' });
    await this.mail.send({
      to: [user.email],
      subject: 'Set a new Meritline password',
      text: [
        `Hello ${user.name},`,
        '',
        `Someone asked to set a new password for your Meritline account at ${this.config.laboratoryName}.`,
        `Set it with this one-time link (valid for ${LINK_MINUTES} minutes):`,
        '',
        this.mail.link(`/reset-password?token=${token}`),
        '',
        'If you did not ask for this, ignore this message: your password stays as it is.',
      ].join('\n'),
    });
    return PASSWORD_RESET_ANSWER;
  }

  async confirmPasswordReset(dto: PasswordResetConfirmDto): Promise<void> {
    const user = await this.usersService.findByLinkToken('passwordResetTokenHash', dto.token);
    this.assertLinkUsable(user, user?.passwordResetExpiresAt, 'Ask for a new link from the sign-in page.');
    this.policy.assertAllowed(dto.password, user.email);
    user.passwordResetTokenHash = null;
    user.passwordResetExpiresAt = null;
    await this.setPassword(user, dto.password, { actor: user, action: 'auth.password-reset-completed' });
    this.attempts.clearAccount(user.email, user.id);
  }

  async confirmUnlock(token: string): Promise<void> {
    const user = await this.usersService.findByLinkToken('unlockTokenHash', token);
    this.assertLinkUsable(user, user?.unlockExpiresAt, 'The lock also lifts by itself after a while.');
    user.unlockTokenHash = null;
    user.unlockExpiresAt = null;
    await this.usersService.saveWithAudit(user, { actor: user, action: 'auth.unlocked', reason: 'by the e-mailed link' });
    this.attempts.clearAccount(user.email, user.id);
  }

  private assertLinkUsable(user: User | null, expiresAt: Date | null | undefined, hint: string): asserts user is User {
    if (!user || !user.active || !expiresAt) {
      throw unprocessable(
        [{ field: 'token', code: 'invalid', message: `This link is not valid or was already used. ${hint}` }],
        'This link is not valid or was already used.',
      );
    }
    if (expiresAt < new Date()) {
      throw unprocessable([{ field: 'token', code: 'expired', message: `This link has expired. ${hint}` }], 'This link has expired.');
    }
  }

  /** The new password ends every session: tokens issued before it are refused. */
  private async setPassword(user: User, password: string, record: Pick<AuditRecord, 'actor' | 'action'>) {
    user.passwordHash = await bcrypt.hash(password, BCRYPT_ROUNDS);
    user.tokenVersion += 1;
    await writeTransaction(this.dataSource, async (manager) => {
      await SessionsService.endAllFor(manager, user.id, 'password-changed');
      await this.usersService.saveWithAudit(user, record);
    });
  }

  private async sendUnlockLink(user: User, action: 'auth.sign-in-locked' | 'signature.locked') {
    const token = randomBytes(32).toString('base64url');
    user.unlockTokenHash = hashToken(token);
    user.unlockExpiresAt = new Date(Date.now() + LINK_MINUTES * 60_000);
    const what = action === 'signature.locked' ? 'Signing with your password' : 'Signing in to your account';
    await this.usersService.saveWithAudit(user, {
      actor: { id: user.id, name: user.name },
      action,
      reason: 'after repeated wrong passwords',
    });
    await this.mail.send({
      to: [user.email],
      subject: 'Your Meritline account is locked for a while',
      text: [
        `Hello ${user.name},`,
        '',
        `${what} was locked after repeated wrong passwords.`,
        `If it was you, lift the lock with this one-time link (valid for ${LINK_MINUTES} minutes):`,
        '',
        this.mail.link(`/unlock?token=${token}`),
        '',
        'If it was not you, tell your administrator: someone may be guessing your password.',
      ].join('\n'),
    });
  }

  private async session(user: User): Promise<LoginResponse> {
    const session = await this.sessions.start(user);
    const accessToken = await this.jwt.signAsync({ sub: user.id, roles: user.roles, sid: session.id, ver: user.tokenVersion });
    return { accessToken, user: { id: user.id, email: user.email, name: user.name, roles: user.roles } };
  }
}
