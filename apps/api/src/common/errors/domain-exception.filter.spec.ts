import { type ArgumentsHost, Logger, NotFoundException } from '@nestjs/common';
import { QueryFailedError } from 'typeorm';
import { JsonTooDeepError } from '../http/guarded-json';
import { DomainExceptionFilter } from './domain-exception.filter';
import { DomainException, ErrorCode } from './domain.exception';

type Sent = { status?: number; body?: unknown; headers?: Record<string, string> };
function hostCapturing(): { host: ArgumentsHost; sent: Sent } {
  const sent: Sent = {};
  const res = {
    setHeader(name: string, value: string) {
      sent.headers = { ...sent.headers, [name]: value };
    },
    status(code: number) {
      sent.status = code;
      return this;
    },
    json(body: unknown) {
      sent.body = body;
    },
  };
  const host = { switchToHttp: () => ({ getResponse: () => res }) } as unknown as ArgumentsHost;
  return { host, sent };
}

describe('DomainExceptionFilter', () => {
  const sut = new DomainExceptionFilter();

  it('returns a domain error as { code, message, fields } with its status', () => {
    const { host, sent } = hostCapturing();
    sut.catch(
      new DomainException(ErrorCode.ValidationFailed, 'Check dip.', { dip: 'Dip must be 0–90°.' }),
      host,
    );
    expect(sent).toEqual({
      status: 400,
      body: { code: 'VALIDATION_FAILED', message: 'Check dip.', fields: { dip: 'Dip must be 0–90°.' } },
    });
  });

  it('maps Nest HTTP exceptions to a code', () => {
    const { host, sent } = hostCapturing();
    sut.catch(new NotFoundException('Cannot GET /api/nothing'), host);
    expect(sent.status).toBe(404);
    expect(sent.body).toMatchObject({ code: 'NOT_FOUND' });
  });

  it('reduces an unknown error to a generic 500 that reveals nothing, and logs it', () => {
    const log = jest.spyOn(Logger.prototype, 'error').mockImplementation(() => undefined);
    const { host, sent } = hostCapturing();
    sut.catch(new Error('ER_ACCESS_DENIED for user root at 10.0.0.3'), host);
    expect(sent.status).toBe(500);
    expect(sent.body).toMatchObject({ code: 'INTERNAL' });
    expect(JSON.stringify(sent.body)).not.toContain('10.0.0.3');
    expect(log).toHaveBeenCalled();
    log.mockRestore();
  });

  it('answers an oversized body with 413', () => {
    const { host, sent } = hostCapturing();
    sut.catch(Object.assign(new Error('request entity too large'), { type: 'entity.too.large' }), host);
    expect(sent).toMatchObject({ status: 413, body: { code: 'PAYLOAD_TOO_LARGE' } });
  });

  const queryFailed = (errno: number, code = 'X') =>
    new QueryFailedError('INSERT …', [], Object.assign(new Error(code), { errno, code }));

  it('answers a duplicate key with 409, a value the column cannot hold with 400 (issue 18, item 4)', () => {
    const dup = hostCapturing();
    sut.catch(queryFailed(1062, 'ER_DUP_ENTRY'), dup.host);
    expect(dup.sent).toMatchObject({ status: 409, body: { code: 'CONFLICT' } });
    for (const errno of [1264, 1406, 1292, 1366, 4025]) {
      const bad = hostCapturing();
      sut.catch(queryFailed(errno), bad.host);
      expect(bad.sent).toMatchObject({ status: 400, body: { code: 'VALIDATION_FAILED' } });
    }
  });

  it('answers a database that is down or busy with 503 and Retry-After, never 500', () => {
    for (const e of [
      queryFailed(1213, 'ER_LOCK_DEADLOCK'),
      queryFailed(1047, 'ER_UNKNOWN_COM_ERROR'),
      Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3308'), {
        code: 'ECONNREFUSED',
        errno: -111,
        fatal: true,
      }),
    ]) {
      const { host, sent } = hostCapturing();
      sut.catch(e, host);
      expect(sent).toMatchObject({
        status: 503,
        body: { code: 'SERVICE_UNAVAILABLE' },
        headers: { 'Retry-After': expect.stringMatching(/^\d+$/) },
      });
    }
    // Another library's network error is not the database's: still a 500 that reveals nothing.
    const log = jest.spyOn(Logger.prototype, 'error').mockImplementation(() => undefined);
    const other = hostCapturing();
    sut.catch(
      Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:2526'), { code: 'ECONNREFUSED' }),
      other.host,
    );
    expect(other.sent.status).toBe(500);
    log.mockRestore();
  });

  it('answers a body nested too deeply with 400', () => {
    const { host, sent } = hostCapturing();
    sut.catch(new JsonTooDeepError(32), host);
    expect(sent).toMatchObject({ status: 400, body: { code: 'VALIDATION_FAILED' } });
  });
});
