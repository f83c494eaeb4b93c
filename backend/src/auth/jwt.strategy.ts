import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { jwtVerificationKey } from './jwt-key.js';
import { hasBearerHeader, sessionCookieOf } from './session-cookie.js';
import { SessionsService, type SessionUser, type TokenPayload } from './sessions.service.js';

const fromAuthHeader = ExtractJwt.fromAuthHeaderAsBearerToken();

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    @Inject(appConfig.KEY) config: AppConfigType,
    private readonly sessions: SessionsService,
  ) {
    const key = jwtVerificationKey(config.jwtSecret);
    super({
      // Scripts and API clients send a bearer token; the web app's calls carry the session cookie.
      jwtFromRequest: (request: Parameters<typeof fromAuthHeader>[0]) =>
        hasBearerHeader(request) ? fromAuthHeader(request) : sessionCookieOf(request),
      ignoreExpiration: false,
      // passport-jwt hands the key to jsonwebtoken as it is; its types predate key objects.
      secretOrKeyProvider: (_request: unknown, _token: unknown, done: (error: null, key: Buffer) => void) =>
        done(null, key as unknown as Buffer),
    });
  }

  /** The session and its user, read afresh on every request (one indexed query). */
  validate(payload: TokenPayload): Promise<SessionUser> {
    return this.sessions.authenticate(payload);
  }
}
