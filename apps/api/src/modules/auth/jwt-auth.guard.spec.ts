import type { ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import passport from 'passport';
import { Strategy } from 'passport-strategy';
import { QueryFailedError } from 'typeorm';
import { DomainException } from '../../common/errors/domain.exception.js';
import { JwtAuthGuard } from './jwt-auth.guard.js';

/** A strategy that fails the way the real one does when reading the token's account throws. */
function failingStrategy(name: string, error: unknown): void {
  class Failing extends Strategy {
    override authenticate(): void {
      this.error(error as Error);
    }
  }
  passport.use(name, new Failing());
}

const context = (): ExecutionContext =>
  ({
    getHandler: () => () => undefined,
    getClass: () => class {},
    switchToHttp: () => ({
      getRequest: () => ({ headers: {} }),
      getResponse: () => ({}),
      getNext: () => undefined,
    }),
    getType: () => 'http',
    getArgs: () => [],
  }) as unknown as ExecutionContext;

const guardFor = (name: string) =>
  new JwtAuthGuard(new Reflector(), { strategyName: name, unregister: () => passport.unuse(name) });

describe('JwtAuthGuard when the token cannot be checked', () => {
  it('a database that does not answer stays a database error (the filter answers 503), not "please sign in"', async () => {
    const down = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3402'), {
      code: 'ECONNREFUSED',
      errno: -111,
      fatal: true,
    }); // as mysql2's pool makes it
    failingStrategy('test-db-down', down);
    const guard = guardFor('test-db-down');
    await expect(guard.canActivate(context())).rejects.toBe(down);
    guard.onModuleDestroy();
  });

  it('a Galera node that is not ready (1047) is a database error too', async () => {
    const notReady = new QueryFailedError(
      'SELECT …',
      [],
      Object.assign(new Error('WSREP has not yet prepared node'), {
        errno: 1047,
        code: 'ER_UNKNOWN_COM_ERROR',
      }),
    );
    failingStrategy('test-not-ready', notReady);
    const guard = guardFor('test-not-ready');
    await expect(guard.canActivate(context())).rejects.toBe(notReady);
    guard.onModuleDestroy();
  });

  it('any other failure reads as a request to sign in (401)', async () => {
    failingStrategy('test-other', new Error('something else'));
    const guard = guardFor('test-other');
    await expect(guard.canActivate(context())).rejects.toBeInstanceOf(DomainException);
    guard.onModuleDestroy();
  });
});
