import { plainToInstance, Transform } from 'class-transformer';
import {
  IsBoolean,
  IsIn,
  IsInt,
  IsNotEmpty,
  IsOptional,
  IsString,
  IsUrl,
  Matches,
  Max,
  MinLength,
  Min,
  ValidateIf,
  validateSync,
} from 'class-validator';

const toBool = ({ value }: { value: unknown }): unknown =>
  value === 'true' || value === '1' ? true : value === 'false' || value === '0' ? false : value;

/**
 * Every variable Roundbook reads, validated once at boot (NestJS config docs' `validate`; immich's EnvDto).
 * Nothing else reads process.env. Driver-specific variables are required only for the chosen driver.
 */
export class EnvironmentVariables {
  @IsIn(['development', 'production', 'test'])
  @IsOptional()
  NODE_ENV: 'development' | 'production' | 'test' = 'production';

  @IsString()
  HOST = '127.0.0.1';

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  @Max(65535)
  PORT = 8080;

  @IsUrl({ require_tld: false, require_protocol: true })
  APP_URL = 'http://127.0.0.1:8080';

  /** Local mode: the SMTP fake's inbox is shown to admins; development conveniences on. */
  @Transform(toBool)
  @IsBoolean()
  LOCAL_MODE = false;

  @IsString()
  @IsNotEmpty()
  DB_HOST: string;

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  @Max(65535)
  DB_PORT: number;

  @Matches(/^[A-Za-z0-9_]+$/, { message: 'DB_NAME may hold only letters, digits and _' })
  DB_NAME: string;

  @IsString()
  @IsNotEmpty()
  DB_USER: string;

  @IsString()
  @IsNotEmpty()
  DB_PASSWORD: string;

  /**
   * Pooled MariaDB connections of this API process (mysql2's connectionLimit, through TypeORM's poolSize).
   * 10 kept: 4, 6, 10 and 20 under `npm run load` on 2 shared cores showed no consistent difference (README).
   */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  @Max(200)
  DB_POOL_SIZE = 10;

  /**
   * How long a request may wait for a pooled connection before it is answered 503 with Retry-After, in
   * milliseconds; also bounds opening a new connection for it.
   */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(50)
  @Max(60000)
  DB_POOL_WAIT_MS = 3000;

  @IsString()
  @MinLength(32, { message: 'JWT_SECRET must be at least 32 characters long' })
  JWT_SECRET: string;

  @Matches(/^\d+[smhd]$/, { message: 'JWT_EXPIRES_IN must look like 30m, 12h or 7d' })
  JWT_EXPIRES_IN = '12h';

  @IsIn(['s3'])
  STORAGE_DRIVER = 's3' as const;

  @ValidateIf((o: EnvironmentVariables) => o.STORAGE_DRIVER === 's3')
  @IsUrl({ require_tld: false, require_protocol: true })
  S3_ENDPOINT: string;

  @IsString()
  S3_REGION = 'us-east-1';

  @ValidateIf((o: EnvironmentVariables) => o.STORAGE_DRIVER === 's3')
  @Matches(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, {
    message: 'S3_BUCKET must be 3–63 lower-case letters, digits, dots or hyphens',
  })
  S3_BUCKET: string;

  @ValidateIf((o: EnvironmentVariables) => o.STORAGE_DRIVER === 's3')
  @IsString()
  @IsNotEmpty()
  S3_ACCESS_KEY_ID: string;

  @ValidateIf((o: EnvironmentVariables) => o.STORAGE_DRIVER === 's3')
  @IsString()
  @IsNotEmpty()
  S3_SECRET_ACCESS_KEY: string;

  @Transform(toBool)
  @IsBoolean()
  S3_FORCE_PATH_STYLE = true;

  @IsIn(['smtp', 'log'])
  MAIL_DRIVER: 'smtp' | 'log' = 'smtp';

  @ValidateIf((o: EnvironmentVariables) => o.MAIL_DRIVER === 'smtp')
  @IsString()
  @IsNotEmpty()
  SMTP_HOST: string;

  @ValidateIf((o: EnvironmentVariables) => o.MAIL_DRIVER === 'smtp')
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  @Max(65535)
  SMTP_PORT: number;

  @Transform(toBool)
  @IsBoolean()
  SMTP_SECURE = false;

  /** Only for the local SMTP fake, whose bundled certificate has expired. */
  @Transform(toBool)
  @IsBoolean()
  SMTP_IGNORE_TLS = false;

  @IsOptional()
  @IsString()
  SMTP_USER?: string;

  @IsOptional()
  @IsString()
  SMTP_PASSWORD?: string;

  @Matches(/^(.+<)?[^<>\s@]+@[^<>\s@]+>?$/, {
    message: 'MAIL_FROM must be an address, e.g. Roundbook <roundbook@example.org>',
  })
  MAIL_FROM = 'Roundbook <roundbook@roundbook.test>';

  @ValidateIf((o: EnvironmentVariables) => o.LOCAL_MODE)
  @IsString()
  @IsNotEmpty({ message: 'LOCAL_MAIL_DIR is required in local mode (the SMTP fake keeps messages there)' })
  LOCAL_MAIL_DIR?: string;

  @IsOptional()
  @IsString()
  WEB_DIST_DIR?: string;

  /** The demo password; used only by the seed command. */
  @IsOptional()
  @IsString()
  @MinLength(8)
  DEMO_PASSWORD?: string;

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  LOGIN_RATE_LIMIT = 10;

  /** Failed sign-ins from one client address (all accounts) before that address waits, with back-off. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  LOGIN_ADDRESS_LIMIT = 100;

  /** Invitation e-mails one project may send in an hour (new invitations and resent links together). */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  INVITATION_EMAIL_LIMIT = 60;

  /** Invitation e-mails to one address in an hour, from all projects together. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  INVITATION_ADDRESS_LIMIT = 5;

  /** Requests per minute per client address on anonymous routes (sign-in, invitations, health). */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  PUBLIC_RATE_LIMIT = 120;

  /**
   * The proxies whose X-Forwarded-For is believed (Express `trust proxy`): empty/none (default) trusts no
   * one; `loopback`, a list of addresses or subnets, or a hop count.
   */
  @IsOptional()
  @IsString()
  @Matches(/^(?!true$)(none|false|\d+|[\w.:/, -]+)$/, {
    message:
      'TRUST_PROXY is none, a hop count, or addresses/subnets (not `true`: trusting everyone is the bypass).',
  })
  TRUST_PROXY?: string;

  /** /api/health runs its database, storage and mail checks at most once per this many seconds. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(0)
  @Max(3600)
  HEALTH_CACHE_SECONDS = 10;

  // --- Background jobs and instance permissions (jobs worker, operators) ---

  /** Whether this API process runs the jobs worker (any number of processes may). */
  @Transform(toBool)
  @IsBoolean()
  WORKER_ENABLED = true;

  /** How often an idle worker looks for due jobs, in milliseconds. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(10)
  @Max(600_000)
  JOBS_POLL_INTERVAL_MS = 1000;

  /** How many jobs one worker runs at once. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  @Max(64)
  JOBS_CONCURRENCY = 4;

  /** Attempts before a job is given up (state dead, its last error kept). */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  @Max(1000)
  JOBS_MAX_ATTEMPTS = 12;

  /** First retry delay; each further attempt doubles it, up to JOBS_BACKOFF_MAX_MS. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  JOBS_BACKOFF_BASE_MS = 5000;

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  JOBS_BACKOFF_MAX_MS = 1_800_000;

  /** A running job whose worker went silent this long is claimed again. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1000)
  JOBS_LEASE_MS = 300_000;

  /** Largest photo accepted, in bytes (25 MiB by default). */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1024)
  PHOTO_MAX_BYTES = 25 * 1024 * 1024;

  /** Size of each part of a photo upload, in bytes: S3 needs at least 5 MiB for every part but the last. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(5 * 1024 * 1024)
  PHOTO_PART_BYTES = 5 * 1024 * 1024;

  /** Who may create projects: anyone signed in, or instance operators only. */
  @IsIn(['anyone', 'operators'])
  PROJECT_CREATION: 'anyone' | 'operators' = 'operators';
}

/** Returns the validated variables or throws one Error listing every problem, one per line. */
export function validateEnvironment(config: Record<string, unknown>): EnvironmentVariables {
  const env = plainToInstance(EnvironmentVariables, config, {
    enableImplicitConversion: false,
    exposeDefaultValues: true,
  });
  const errors = validateSync(env, { skipMissingProperties: false, whitelist: false });
  if (errors.length > 0) {
    const lines = errors.map((e) => {
      const value = config[e.property];
      const shown =
        value === undefined ? 'missing' : e.property.match(/PASSWORD|SECRET/) ? 'set' : JSON.stringify(value);
      return `  ${e.property} (${shown}): ${Object.values(e.constraints ?? {}).join('; ')}`;
    });
    throw new Error(
      `Roundbook cannot start: the environment is not valid.\n${lines.join('\n')}\nSee .env.example for every variable.`,
    );
  }
  return env;
}
