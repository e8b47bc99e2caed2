import { validateEnvironment } from './env.validation';

const valid = {
  DB_HOST: '127.0.0.1',
  DB_PORT: '3307',
  DB_NAME: 'roundbook',
  DB_USER: 'roundbook',
  DB_PASSWORD: 'pw',
  JWT_SECRET: 'a'.repeat(40),
  S3_ENDPOINT: 'http://127.0.0.1:4569',
  S3_BUCKET: 'roundbook',
  S3_ACCESS_KEY_ID: 'k',
  S3_SECRET_ACCESS_KEY: 's',
  SMTP_HOST: '127.0.0.1',
  SMTP_PORT: '2525',
};

describe('validateEnvironment', () => {
  it('accepts a complete environment and converts numbers and booleans', () => {
    const sut = validateEnvironment({
      ...valid,
      LOCAL_MODE: 'true',
      LOCAL_MAIL_DIR: '/tmp/mail',
      PORT: '9090',
    });
    expect(sut).toMatchObject({
      DB_PORT: 3307,
      PORT: 9090,
      LOCAL_MODE: true,
      SMTP_PORT: 2525,
      JWT_EXPIRES_IN: '12h',
    });
  });

  it('lists every bad variable on its own line, without printing secrets', () => {
    const run = () =>
      validateEnvironment({
        ...valid,
        DB_HOST: undefined,
        JWT_SECRET: 'short-secret',
        S3_BUCKET: 'Ab',
        PORT: '99999',
      });
    expect(run).toThrow(/environment is not valid/);
    try {
      run();
    } catch (e) {
      const message = (e as Error).message;
      expect(message).toMatch(/DB_HOST \(missing\)/);
      expect(message).toMatch(/JWT_SECRET \(set\): JWT_SECRET must be at least 32 characters/);
      expect(message).not.toContain('short-secret');
      expect(message).toMatch(/S3_BUCKET \("Ab"\)/);
      expect(message).toMatch(/PORT \("99999"\)/);
    }
  });

  it('requires the SMTP address only for the smtp mail driver', () => {
    expect(() => validateEnvironment({ ...valid, SMTP_HOST: undefined, SMTP_PORT: undefined })).toThrow(
      /SMTP_HOST/,
    );
    expect(
      validateEnvironment({ ...valid, SMTP_HOST: undefined, SMTP_PORT: undefined, MAIL_DRIVER: 'log' })
        .MAIL_DRIVER,
    ).toBe('log');
  });

  it('requires the local inbox folder in local mode', () => {
    expect(() => validateEnvironment({ ...valid, LOCAL_MODE: 'true' })).toThrow(/LOCAL_MAIL_DIR/);
  });

  it('has a pool of 10 connections and a 3 s wait by default, and takes integers in range', () => {
    expect(validateEnvironment(valid)).toMatchObject({ DB_POOL_SIZE: 10, DB_POOL_WAIT_MS: 3000 });
    expect(validateEnvironment({ ...valid, DB_POOL_SIZE: '4', DB_POOL_WAIT_MS: '500' })).toMatchObject({
      DB_POOL_SIZE: 4,
      DB_POOL_WAIT_MS: 500,
    });
  });

  it.each([
    ['DB_POOL_SIZE', '0'],
    ['DB_POOL_SIZE', '2.5'],
    ['DB_POOL_SIZE', 'ten'],
    ['DB_POOL_SIZE', '201'],
    ['DB_POOL_WAIT_MS', '49'],
    ['DB_POOL_WAIT_MS', '60001'],
    ['DB_POOL_WAIT_MS', '3s'],
  ])('refuses %s=%s, naming the variable', (name, value) => {
    expect(() => validateEnvironment({ ...valid, [name]: value })).toThrow(
      new RegExp(`${name} \\("${value.replace('.', '\\.')}"\\)`),
    );
  });
});
