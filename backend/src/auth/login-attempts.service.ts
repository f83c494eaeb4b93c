import { HttpException, HttpStatus, Inject, Injectable } from '@nestjs/common';
import { appConfig, type AppConfigType } from '../config/app.config.js';

/** Failed sign-ins per account and per address in a sliding window; successes are never counted. */
@Injectable()
export class LoginAttemptsService {
  private readonly failures = new Map<string, number[]>();

  constructor(@Inject(appConfig.KEY) private readonly config: AppConfigType) {}

  private keys(email: string, address: string) {
    return [
      { key: this.accountKey(email), limit: this.config.throttle.perAccount },
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

  /** True when this failure is the one that locks the account. */
  recordFailure(email: string, address: string, now = Date.now()): boolean {
    for (const { key } of this.keys(email, address)) this.failures.set(key, [...this.recent(key, now), now]);
    return this.recent(this.accountKey(email), now).length === this.config.throttle.perAccount;
  }

  /** Wrong passwords re-entered to sign count per account, apart from sign-in, with the same limit and window. */
  assertSigningAllowed(userId: string, now = Date.now()) {
    const recent = this.recent(`signing:${userId}`, now);
    if (recent.length >= this.config.throttle.perAccount) {
      const retryAfterS = Math.ceil((recent[0] + this.config.throttle.windowMs - now) / 1000);
      throw new HttpException(
        {
          statusCode: 429,
          message: `Signing is locked after repeated wrong passwords. Try again in ${Math.ceil(retryAfterS / 60)} minute(s), or use the unlock link sent to your e-mail address.`,
        },
        HttpStatus.TOO_MANY_REQUESTS,
      );
    }
  }

  /** True when this failure is the one that locks signing. */
  recordSigningFailure(userId: string, now = Date.now()): boolean {
    const key = `signing:${userId}`;
    this.failures.set(key, [...this.recent(key, now), now]);
    return this.recent(key, now).length === this.config.throttle.perAccount;
  }

  /** Lifts the account's sign-in and signing locks (not the per-address one, which guards against guessing across accounts). */
  clearAccount(email: string, userId: string) {
    this.failures.delete(this.accountKey(email));
    this.failures.delete(`signing:${userId}`);
  }

  private accountKey(email: string) {
    return `account:${email.trim().toLowerCase()}`;
  }
}
