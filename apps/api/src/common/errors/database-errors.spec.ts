import { type ArgumentsHost, Logger } from '@nestjs/common';
import { QueryFailedError } from 'typeorm';
import { isCalendarDate } from '../dto/calendar-date';
import { guardedJson, jsonDepthExceeds } from '../http/guarded-json';
import { hasLoneSurrogate } from '../http/well-formed-text';
import { DomainExceptionFilter } from './domain-exception.filter';

// Issue 18 item 4: database errors become 400 / 409 / 503 with Retry-After, never 500.
const failed = (errno: number, code: string) =>
  new QueryFailedError('INSERT …', [], Object.assign(new Error(code), { errno, code }));

function answer(exception: unknown): { status?: number; body?: any; headers: Record<string, string> } {
  const sent: { status?: number; body?: any; headers: Record<string, string> } = { headers: {} };
  const res = {
    status(code: number) {
      sent.status = code;
      return this;
    },
    setHeader(name: string, value: string) {
      sent.headers[name] = value;
    },
    json(body: unknown) {
      sent.body = body;
    },
  };
  const host = { switchToHttp: () => ({ getResponse: () => res }) } as unknown as ArgumentsHost;
  new DomainExceptionFilter().catch(exception, host);
  return sent;
}

describe('database errors through the global filter', () => {
  it.each([
    [1062, 'ER_DUP_ENTRY', 409, 'CONFLICT'],
    [1264, 'ER_WARN_DATA_OUT_OF_RANGE', 400, 'VALIDATION_FAILED'],
    [1406, 'ER_DATA_TOO_LONG', 400, 'VALIDATION_FAILED'],
    [1292, 'ER_TRUNCATED_WRONG_VALUE', 400, 'VALIDATION_FAILED'],
    [4025, 'ER_CONSTRAINT_FAILED', 400, 'VALIDATION_FAILED'],
    [1205, 'ER_LOCK_WAIT_TIMEOUT', 503, 'SERVICE_UNAVAILABLE'],
    [2013, 'CR_SERVER_LOST', 503, 'SERVICE_UNAVAILABLE'],
  ])('errno %i (%s) → %i %s', (errno, code, status, bodyCode) => {
    const sent = answer(failed(errno, code));
    expect(sent.status).toBe(status);
    expect(sent.body.code).toBe(bodyCode);
    expect(sent.body.message).not.toMatch(/INSERT|ER_/);
    if (status === 503) expect(Number(sent.headers['Retry-After'])).toBeGreaterThan(0);
  });

  it('a refused connection from the pool (no query yet) is 503 with Retry-After', () => {
    const e = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3306'), {
      code: 'ECONNREFUSED',
      errno: -111,
      fatal: true,
    });
    const sent = answer(e);
    expect(sent).toMatchObject({ status: 503, headers: { 'Retry-After': '10' } });
    expect(JSON.stringify(sent.body)).not.toContain('127.0.0.1');
  });

  it('an unknown query error stays a generic 500', () => {
    const log = jest.spyOn(Logger.prototype, 'error').mockImplementation(() => undefined);
    expect(answer(failed(1146, 'ER_NO_SUCH_TABLE')).status).toBe(500);
    log.mockRestore();
  });
});

describe('body and value guards', () => {
  it('measures JSON depth on the raw bytes, ignoring brackets inside strings', () => {
    expect(jsonDepthExceeds(Buffer.from('[[[]]]'), 3)).toBe(false);
    expect(jsonDepthExceeds(Buffer.from('[[[[]]]]'), 3)).toBe(true);
    expect(jsonDepthExceeds(Buffer.from('{"a":"[[[[[[\\"[["}'), 2)).toBe(false);
  });

  it('names the parser jsonParser so Nest adds no default one beside it', () => {
    expect(guardedJson().name).toBe('jsonParser');
  });

  it('knows real calendar dates', () => {
    expect(['2026-02-28', '2028-02-29', '2026-12-31'].map(isCalendarDate)).toEqual([true, true, true]);
    expect(['2026-02-30', '0000-00-00', '2026-13-01', '2027-02-29', '26-1-1'].map(isCalendarDate)).toEqual([
      false,
      false,
      false,
      false,
      false,
    ]);
  });

  it('finds lone surrogates, not pairs', () => {
    expect(hasLoneSurrogate('crown \ud83d\ude00')).toBe(false);
    expect(hasLoneSurrogate('crown \ud83d')).toBe(true);
    expect(hasLoneSurrogate('\ude00 crown')).toBe(true);
  });
});
