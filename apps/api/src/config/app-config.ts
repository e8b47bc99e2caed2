import { validateEnvironment, type EnvironmentVariables } from './env.validation.js';

/** The typed configuration, built once from the validated environment and injected where needed. */
export interface AppConfig {
  env: EnvironmentVariables['NODE_ENV'];
  host: string;
  port: number;
  appUrl: string;
  localMode: boolean;
  database: {
    host: string;
    port: number;
    name: string;
    user: string;
    password: string;
    /** Pooled connections of this process */
    poolSize: number;
    /** Longest wait for a pooled connection before a 503, ms */
    poolWaitMs: number;
  };
  auth: {
    jwtSecret: string;
    jwtExpiresIn: string;
    loginRateLimit: number;
    loginAddressLimit: number;
    /** Invitation e-mails per project per hour */
    invitationEmailLimit: number;
    /** Invitation e-mails per address per hour (all projects) */
    invitationAddressLimit: number;
    publicRateLimit: number;
  };
  /** Express `trust proxy`: false (none) unless TRUST_PROXY names the proxies in front */
  trustProxy: boolean | number | string;
  /** Readiness checks are reused this long */
  healthCacheSeconds: number;
  storage: {
    driver: 's3';
    endpoint: string;
    region: string;
    bucket: string;
    accessKeyId: string;
    secretAccessKey: string;
    forcePathStyle: boolean;
  };
  mail: {
    driver: 'smtp' | 'log';
    host: string;
    port: number;
    secure: boolean;
    ignoreTls: boolean;
    user?: string;
    password?: string;
    from: string;
    localInboxDir?: string;
  };
  webDistDir?: string;
  demoPassword?: string;
  jobs: {
    workerEnabled: boolean;
    pollIntervalMs: number;
    concurrency: number;
    maxAttempts: number;
    backoffBaseMs: number;
    backoffMaxMs: number;
    leaseMs: number;
  };
  photos: { maxBytes: number; partBytes: number };
  projectCreation: 'anyone' | 'operators';
}

export const APP_CONFIG = Symbol('APP_CONFIG');

/** TRUST_PROXY as Express reads it: empty or `none` → trust no proxy; a hop count; or addresses/subnets. */
export function trustProxyOf(value: string | undefined): boolean | number | string {
  const v = (value ?? '').trim();
  if (v === '' || v === 'none' || v === 'false') return false;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}

export function toAppConfig(e: EnvironmentVariables): AppConfig {
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    appUrl: e.APP_URL.replace(/\/$/, ''),
    localMode: e.LOCAL_MODE,
    database: {
      host: e.DB_HOST,
      port: e.DB_PORT,
      name: e.DB_NAME,
      user: e.DB_USER,
      password: e.DB_PASSWORD,
      poolSize: e.DB_POOL_SIZE,
      poolWaitMs: e.DB_POOL_WAIT_MS,
    },
    auth: {
      jwtSecret: e.JWT_SECRET,
      jwtExpiresIn: e.JWT_EXPIRES_IN,
      loginRateLimit: e.LOGIN_RATE_LIMIT,
      loginAddressLimit: e.LOGIN_ADDRESS_LIMIT,
      invitationEmailLimit: e.INVITATION_EMAIL_LIMIT,
      invitationAddressLimit: e.INVITATION_ADDRESS_LIMIT,
      publicRateLimit: e.PUBLIC_RATE_LIMIT,
    },
    trustProxy: trustProxyOf(e.TRUST_PROXY),
    healthCacheSeconds: e.HEALTH_CACHE_SECONDS,
    storage: {
      driver: e.STORAGE_DRIVER,
      endpoint: e.S3_ENDPOINT,
      region: e.S3_REGION,
      bucket: e.S3_BUCKET,
      accessKeyId: e.S3_ACCESS_KEY_ID,
      secretAccessKey: e.S3_SECRET_ACCESS_KEY,
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
    },
    mail: {
      driver: e.MAIL_DRIVER,
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      ignoreTls: e.SMTP_IGNORE_TLS,
      user: e.SMTP_USER,
      password: e.SMTP_PASSWORD,
      from: e.MAIL_FROM,
      localInboxDir: e.LOCAL_MAIL_DIR,
    },
    webDistDir: e.WEB_DIST_DIR,
    demoPassword: e.DEMO_PASSWORD,
    jobs: {
      workerEnabled: e.WORKER_ENABLED,
      pollIntervalMs: e.JOBS_POLL_INTERVAL_MS,
      concurrency: e.JOBS_CONCURRENCY,
      maxAttempts: e.JOBS_MAX_ATTEMPTS,
      backoffBaseMs: e.JOBS_BACKOFF_BASE_MS,
      backoffMaxMs: e.JOBS_BACKOFF_MAX_MS,
      leaseMs: e.JOBS_LEASE_MS,
    },
    photos: { maxBytes: e.PHOTO_MAX_BYTES, partBytes: e.PHOTO_PART_BYTES },
    projectCreation: e.PROJECT_CREATION,
  };
}

/** Reads and validates process.env: the one place that does. */
export function loadAppConfig(): AppConfig {
  return toAppConfig(validateEnvironment(process.env));
}
