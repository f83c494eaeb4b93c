import { Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import {
  InjectThrottlerOptions,
  InjectThrottlerStorage,
  ThrottlerGuard,
  type ThrottlerModuleOptions,
  type ThrottlerStorage,
} from '@nestjs/throttler';
import { BearerTokens } from '../../auth/bearer-tokens.js';

/**
 * Signed-in requests count against their account, the rest against their address: a laboratory whose
 * users share one address behind a proxy is not throttled as if it were one user.
 */
@Injectable()
export class AccountThrottlerGuard extends ThrottlerGuard {
  constructor(
    @InjectThrottlerOptions() options: ThrottlerModuleOptions,
    @InjectThrottlerStorage() storage: ThrottlerStorage,
    reflector: Reflector,
    private readonly tokens: BearerTokens,
  ) {
    super(options, storage, reflector);
  }

  // An invalid token counts against its address until the JWT guard refuses it.
  protected override getTracker(req: { headers?: Record<string, unknown>; ip?: string }): Promise<string> {
    const account = this.tokens.payloadOf(req)?.sub;
    return Promise.resolve(typeof account === 'string' ? `account:${account}` : `address:${req.ip ?? 'unknown'}`);
  }
}
