import { Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { UsersService } from '../users/users.service.js';

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    @Inject(appConfig.KEY) config: AppConfigType,
    private readonly usersService: UsersService,
  ) {
    super({ jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(), ignoreExpiration: false, secretOrKey: config.jwtSecret });
  }

  /** Reads the user on every request so deactivation and role changes take effect at once. */
  async validate(payload: { sub: string }): Promise<AuthUser> {
    const user = await this.usersService.findById(payload.sub).catch(() => null);
    if (!user || !user.active || !user.passwordHash) throw new UnauthorizedException('Your session is no longer valid. Sign in again.');
    return { id: user.id, email: user.email, name: user.name, roles: user.roles };
  }
}
