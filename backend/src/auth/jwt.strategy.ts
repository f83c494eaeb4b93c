import { Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { UsersService } from '../users/users.service.js';
import { jwtVerificationKey } from './jwt-key.js';
import { SESSION_ENDED, SessionsService, type TokenPayload } from './sessions.service.js';

export type SessionUser = AuthUser & { sessionId: string };

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    @Inject(appConfig.KEY) config: AppConfigType,
    private readonly usersService: UsersService,
    private readonly sessions: SessionsService,
  ) {
    const key = jwtVerificationKey(config.jwtSecret);
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      ignoreExpiration: false,
      // passport-jwt hands the key to jsonwebtoken as it is; its types predate key objects.
      secretOrKeyProvider: (_request: unknown, _token: unknown, done: (error: null, key: Buffer) => void) =>
        done(null, key as unknown as Buffer),
    });
  }

  /** Reads the user and the session on every request so sign-out, deactivation, password and role changes take effect at once. */
  async validate(payload: TokenPayload): Promise<SessionUser> {
    const user = await this.usersService.findById(payload.sub).catch(() => null);
    if (!user || !user.active || !user.passwordHash) throw new UnauthorizedException(SESSION_ENDED);
    const session = await this.sessions.touch(payload, user);
    return { id: user.id, email: user.email, name: user.name, roles: user.roles, sessionId: session.id };
  }
}
