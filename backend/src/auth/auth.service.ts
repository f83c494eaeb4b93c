import { BadRequestException, Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import bcrypt from 'bcryptjs';
import type { LoginResponse } from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import { unprocessable } from '../common/validation.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import type { User } from '../users/user.entity.js';
import { UsersService } from '../users/users.service.js';
import type { AcceptInvitationDto } from './dto/accept-invitation.dto.js';
import type { ChangePasswordDto } from './dto/change-password.dto.js';
import type { LoginDto } from './dto/login.dto.js';
import { LoginAttemptsService } from './login-attempts.service.js';

const BCRYPT_ROUNDS = 10;
const BAD_CREDENTIALS = 'E-mail or password is incorrect.';
// Compared against when the account does not exist, so both failures take the same time.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', BCRYPT_ROUNDS);

@Injectable()
export class AuthService {
  constructor(
    private readonly usersService: UsersService,
    private readonly jwt: JwtService,
    private readonly attempts: LoginAttemptsService,
    private readonly audit: AuditService,
  ) {}

  async login(dto: LoginDto, address: string): Promise<LoginResponse> {
    this.attempts.assertAllowed(dto.email, address);
    const user = await this.usersService.findByEmail(dto.email);
    const valid = await bcrypt.compare(dto.password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !user.passwordHash || !valid || !user.active) {
      this.attempts.recordFailure(dto.email, address);
      await this.audit.record({
        actor: { id: user?.id ?? null, name: dto.email.slice(0, 254) },
        action: 'auth.sign-in-failed',
        entity: 'user',
        entityId: user?.id ?? null,
        reason: `from ${address}`,
      });
      throw new UnauthorizedException(BAD_CREDENTIALS);
    }
    user.lastSignInAt = new Date();
    await this.usersService.saveWithAudit(user, { actor: user, action: 'auth.signed-in', reason: `from ${address}` });
    return this.session(user);
  }

  /** Re-entry of the password for an electronic signature. */
  async verifyPassword(userId: string, password: string): Promise<boolean> {
    const user = await this.usersService.findById(userId);
    return !!user.passwordHash && (await bcrypt.compare(password, user.passwordHash));
  }

  async changePassword(actor: AuthUser, dto: ChangePasswordDto): Promise<void> {
    const user = await this.usersService.findById(actor.id);
    if (!user.passwordHash || !(await bcrypt.compare(dto.currentPassword, user.passwordHash))) {
      throw unprocessable([{ field: 'currentPassword', code: 'incorrect', message: 'The current password is not correct.' }]);
    }
    user.passwordHash = await bcrypt.hash(dto.newPassword, BCRYPT_ROUNDS);
    await this.usersService.saveWithAudit(user, { actor, action: 'auth.password-changed' });
  }

  async acceptInvitation(dto: AcceptInvitationDto): Promise<LoginResponse> {
    const passwordHash = await bcrypt.hash(dto.password, BCRYPT_ROUNDS);
    const user = await this.usersService.acceptInvitation(dto.token, dto.name.trim(), passwordHash);
    if (!user) throw new BadRequestException('This invitation link is not valid or has expired. Ask an administrator for a new one.');
    return this.session(user);
  }

  private async session(user: User): Promise<LoginResponse> {
    const accessToken = await this.jwt.signAsync({ sub: user.id, roles: user.roles });
    return { accessToken, user: { id: user.id, email: user.email, name: user.name, roles: user.roles } };
  }
}
