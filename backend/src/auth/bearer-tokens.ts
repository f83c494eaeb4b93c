import { Inject, Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { jwtVerificationKey } from './jwt-key.js';
import type { TokenPayload } from './sessions.service.js';

/** `<scheme> <token>`; the scheme is matched without regard to case, as HTTP authentication schemes are. */
const AUTHORIZATION = /(\S+)\s+(\S+)/;

/**
 * The verified payload of a request's bearer token, or null when it has none or a forged or expired one: the
 * throttler counts signed-in requests against the account before the JWT guard signs the request in.
 */
@Injectable()
export class BearerTokens {
  private readonly tokens: JwtService;

  constructor(@Inject(appConfig.KEY) config: AppConfigType) {
    this.tokens = new JwtService({ secret: jwtVerificationKey(config.jwtSecret) });
  }

  payloadOf(request: { headers?: Record<string, unknown> }): TokenPayload | null {
    const header = request.headers?.authorization;
    const parts = typeof header === 'string' ? AUTHORIZATION.exec(header) : null;
    if (!parts || parts[1].toLowerCase() !== 'bearer') return null;
    try {
      const payload = this.tokens.verify<TokenPayload>(parts[2]);
      return typeof payload === 'object' && payload !== null ? payload : null;
    } catch {
      return null;
    }
  }
}
