import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';

/** Failures are forgotten this long after the last one. */
const FORGET_AFTER_MS = 15 * 60_000;
/** The first block lasts this long and doubles with every further failure, up to the cap. */
const FIRST_BLOCK_MS = 30_000;
const MAX_BLOCK_MS = 15 * 60_000;
/** Forgotten tallies removed per failure at most, so the table stays as small as the last 15 minutes. */
const PRUNE_BATCH = 200;

/**
 * Failed sign-ins counted per account and per client address, each with its own allowance and a block that
 * doubles with every failure past it. One person's typos block that account only; an address is blocked
 * only after many more failures (a site behind one address keeps working). A success clears the account.
 *
 * The tallies live in MariaDB (`sign_in_tallies`), so every API process behind the same database counts the
 * same failures and a restart forgets no block. Each count is one atomic upsert (no read-then-write, and no
 * `FOR UPDATE` on a row that may not exist yet, whose gap lock deadlocks two first failures).
 */
@Injectable()
export class LoginAttempts {
  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @InjectDataSource() private readonly db: DataSource,
  ) {}

  /** Throws 429 with a retry hint when the account or the address is blocked. */
  async assertAllowed(email: string, address: string, now = Date.now()): Promise<void> {
    const rows = await this.db.query<{ blockedUntil: string | number }[]>(
      'SELECT `blocked_until_ms` AS blockedUntil FROM `sign_in_tallies` WHERE `tally_key` IN (?, ?)',
      [accountKey(email), addressKey(address)],
    );
    const wait = Math.max(0, ...rows.map((r) => Number(r.blockedUntil) - now));
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

  async failed(email: string, address: string, now = Date.now()): Promise<void> {
    await this.count(accountKey(email), this.config.auth.loginRateLimit, now);
    await this.count(addressKey(address), this.config.auth.loginAddressLimit, now);
    await this.db.query(
      'DELETE FROM `sign_in_tallies` WHERE `last_failure_ms` < ? AND `blocked_until_ms` <= ? LIMIT ' +
        String(PRUNE_BATCH),
      [now - FORGET_AFTER_MS, now],
    );
  }

  async succeeded(email: string): Promise<void> {
    await this.db.query('DELETE FROM `sign_in_tallies` WHERE `tally_key` = ?', [accountKey(email)]);
  }

  private async count(key: string, allowance: number, now: number): Promise<void> {
    // A tally whose last failure is over 15 minutes old and whose block has run out starts again at 1.
    // `failures` is assigned before `last_failure_ms`, so it reads the old value whether MariaDB assigns
    // left to right (its default) or simultaneously (SIMULTANEOUS_ASSIGNMENT).
    await this.db.query(
      'INSERT INTO `sign_in_tallies` (`tally_key`, `failures`, `last_failure_ms`, `blocked_until_ms`) VALUES (?, 1, ?, 0) ' +
        'ON DUPLICATE KEY UPDATE ' +
        '`failures` = IF(`last_failure_ms` < ? AND `blocked_until_ms` <= ?, 1, `failures` + 1), ' +
        '`last_failure_ms` = ?',
      [key, now, now - FORGET_AFTER_MS, now, now],
    );
    // The block follows the count just written (a second statement, so it never reads a stale count).
    await this.db.query(
      'UPDATE `sign_in_tallies` SET `blocked_until_ms` = ? + LEAST(?, ? * POW(2, LEAST(CAST(`failures` AS SIGNED) - ?, 20))) ' +
        'WHERE `tally_key` = ? AND `failures` >= ?',
      [now, MAX_BLOCK_MS, FIRST_BLOCK_MS, allowance, key, allowance],
    );
  }
}

const accountKey = (email: string) => `a:${email.slice(0, 330)}`;
const addressKey = (address: string) => `ip:${address.slice(0, 330)}`;
