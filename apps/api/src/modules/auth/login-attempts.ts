import { Inject, Injectable } from '@nestjs/common';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';

interface Tally {
  failures: number;
  /** No attempt is heard before this time (ms since epoch) */
  blockedUntil: number;
  lastFailure: number;
}

/** Failures are forgotten this long after the last one. */
const FORGET_AFTER_MS = 15 * 60_000;
/** The first block lasts this long and doubles with every further failure, up to the cap. */
const FIRST_BLOCK_MS = 30_000;
const MAX_BLOCK_MS = 15 * 60_000;
/** Tallies kept at most (oldest dropped), so a flood of invented e-mails cannot fill the memory. */
const MAX_TALLIES = 50_000;

/**
 * Failed sign-ins counted per account and per client address, each with its own allowance and a block that
 * doubles with every failure past it. One person's typos block that account only; an address is blocked
 * only after many more failures (a site behind one address keeps working). A success clears the account.
 */
@Injectable()
export class LoginAttempts {
  private readonly tallies = new Map<string, Tally>();

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  /** Throws 429 with a retry hint when the account or the address is blocked. */
  assertAllowed(email: string, address: string, now = Date.now()): void {
    const wait = Math.max(this.blockedFor(`a:${email}`, now), this.blockedFor(`ip:${address}`, now));
    if (wait > 0) {
      const seconds = Math.ceil(wait / 1000);
      throw new DomainException(
        ErrorCode.TooManyRequests,
        `Too many failed sign-ins. Wait ${seconds} s and try again.`,
        undefined,
        { retryAfterSeconds: seconds },
      );
    }
  }

  failed(email: string, address: string, now = Date.now()): void {
    this.count(`a:${email}`, this.config.auth.loginRateLimit, now);
    this.count(`ip:${address}`, this.config.auth.loginAddressLimit, now);
  }

  succeeded(email: string): void {
    this.tallies.delete(`a:${email}`);
  }

  private blockedFor(key: string, now: number): number {
    const t = this.tallies.get(key);
    if (!t) return 0;
    if (now - t.lastFailure > FORGET_AFTER_MS && now >= t.blockedUntil) {
      this.tallies.delete(key);
      return 0;
    }
    return Math.max(0, t.blockedUntil - now);
  }

  private count(key: string, allowance: number, now: number): void {
    let t = this.tallies.get(key);
    if (t && now - t.lastFailure > FORGET_AFTER_MS && now >= t.blockedUntil) t = undefined;
    t ??= { failures: 0, blockedUntil: 0, lastFailure: now };
    t.failures++;
    t.lastFailure = now;
    const over = t.failures - allowance;
    if (over >= 0) t.blockedUntil = now + Math.min(MAX_BLOCK_MS, FIRST_BLOCK_MS * 2 ** Math.min(over, 20));
    this.tallies.delete(key); // re-insert: the Map stays in order of last use
    this.tallies.set(key, t);
    if (this.tallies.size > MAX_TALLIES) this.tallies.delete(this.tallies.keys().next().value!);
  }
}
