import { Inject, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { JwtService } from '@nestjs/jwt';
import {
  InjectThrottlerOptions,
  InjectThrottlerStorage,
  ThrottlerGuard,
  type ThrottlerModuleOptions,
  type ThrottlerStorage,
} from '@nestjs/throttler';
import { jwtVerificationKey } from '../../auth/jwt-key.js';
import { appConfig, type AppConfigType } from '../../config/app.config.js';

/**
 * Signed-in requests count against their account, the rest against their address: a laboratory whose
 * users share one address behind a proxy is not throttled as if it were one user.
 */
@Injectable()
export class AccountThrottlerGuard extends ThrottlerGuard {
  private readonly tokens: JwtService;

  constructor(
    @InjectThrottlerOptions() options: ThrottlerModuleOptions,
    @InjectThrottlerStorage() storage: ThrottlerStorage,
    reflector: Reflector,
    @Inject(appConfig.KEY) config: AppConfigType,
  ) {
    super(options, storage, reflector);
    this.tokens = new JwtService({ secret: jwtVerificationKey(config.jwtSecret) });
  }

  protected override async getTracker(req: { headers?: Record<string, unknown>; ip?: string }): Promise<string> {
    const header = req.headers?.authorization;
    if (typeof header === 'string' && header.startsWith('Bearer ')) {
      try {
        const { sub } = await this.tokens.verifyAsync<{ sub: string }>(header.slice(7));
        return `account:${sub}`;
      } catch {
        // An invalid token is refused later by the JWT guard; until then it counts against its address.
      }
    }
    return `address:${req.ip ?? 'unknown'}`;
  }
}
