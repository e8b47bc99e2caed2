import { type ArgumentsHost, Logger, NotFoundException } from '@nestjs/common';
import { DomainExceptionFilter } from './domain-exception.filter';
import { DomainException, ErrorCode } from './domain.exception';

function hostCapturing(): { host: ArgumentsHost; sent: { status?: number; body?: unknown } } {
  const sent: { status?: number; body?: unknown } = {};
  const res = {
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
});
