import { Inject, Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { jwtVerificationKey } from './jwt-key.js';
import { hasBearerHeader, sessionCookieOf } from './session-cookie.js';
import type { TokenPayload } from './sessions.service.js';

/** `<scheme> <token>`; the scheme is matched without regard to case, as HTTP authentication schemes are. */
const AUTHORIZATION = /(\S+)\s+(\S+)/;

/**
 * The verified payload of a request's bearer token (or, without an Authorization header, its session cookie), or null when it has none or a forged or expired one: the
 * throttler counts signed-in requests against the account before the JWT guard signs the request in.
 */
@Injectable()
export class BearerTokens {
  private readonly tokens: JwtService;

  constructor(@Inject(appConfig.KEY) config: AppConfigType) {
    this.tokens = new JwtService({ secret: jwtVerificationKey(config.jwtSecret) });
  }

  payloadOf(request: { headers?: Record<string, unknown> }): TokenPayload | null {
    const token = hasBearerHeader(request) ? this.bearerOf(request.headers?.authorization as string) : sessionCookieOf(request);
    if (token === null) return null;
    try {
      const payload = this.tokens.verify<TokenPayload>(token);
      return typeof payload === 'object' && payload !== null ? payload : null;
    } catch {
      return null;
    }
  }

  private bearerOf(header: string): string | null {
    const parts = AUTHORIZATION.exec(header);
    return parts && parts[1].toLowerCase() === 'bearer' ? parts[2] : null;
  }
}
