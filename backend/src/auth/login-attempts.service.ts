import { HttpException, HttpStatus, Inject, Injectable } from '@nestjs/common';
import { appConfig, type AppConfigType } from '../config/app.config.js';

/** Failed sign-ins per account and per address in a sliding window; successes are never counted. */
@Injectable()
export class LoginAttemptsService {
  private readonly failures = new Map<string, number[]>();

  constructor(@Inject(appConfig.KEY) private readonly config: AppConfigType) {}

  private keys(email: string, address: string) {
    return [
      { key: `account:${email.trim().toLowerCase()}`, limit: this.config.throttle.perAccount },
      { key: `address:${address}`, limit: this.config.throttle.perAddress },
    ];
  }

  private recent(key: string, now: number): number[] {
    const since = now - this.config.throttle.windowMs;
    const kept = (this.failures.get(key) ?? []).filter((at) => at > since);
    if (kept.length) this.failures.set(key, kept);
    else this.failures.delete(key);
    return kept;
  }

  assertAllowed(email: string, address: string, now = Date.now()) {
    for (const { key, limit } of this.keys(email, address)) {
      const recent = this.recent(key, now);
      if (recent.length >= limit) {
        const retryAfterS = Math.ceil((recent[0] + this.config.throttle.windowMs - now) / 1000);
        throw new HttpException(
          { statusCode: 429, message: `Too many failed sign-in attempts. Try again in ${Math.ceil(retryAfterS / 60)} minute(s).` },
          HttpStatus.TOO_MANY_REQUESTS,
        );
      }
    }
  }

  recordFailure(email: string, address: string, now = Date.now()) {
    for (const { key } of this.keys(email, address)) this.failures.set(key, [...this.recent(key, now), now]);
  }
}
