import { z } from 'zod';

const DEVELOPMENT_SESSION_SECRET = 'leadline-development-session-secret';

const ConfigSchema = z.object({
  DATABASE_URL: z
    .string({ error: 'DATABASE_URL is required (npm start sets it; e.g. postgres://app@127.0.0.1:54321/leadline)' })
    .regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must start with postgres:// or postgresql://'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  HOST: z.string().min(1).default('127.0.0.1'),
  WEB_DIST: z.string().optional(),
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET needs at least 32 characters').optional(),
  COOKIE_SECURE: z.enum(['true', 'false']).optional(),
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, 'SMTP_URL must start with smtp:// or smtps://')
    .optional(),
  MAIL_FROM: z.string().min(3).default('Leadline <leadline@localhost>'),
  PUBLIC_URL: z.url('PUBLIC_URL must be a URL such as https://leadline.example.org').optional(),
  UPLOAD_LIMIT_MB: z.coerce.number().positive().max(4096).default(100),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  TILE_URL: z
    .string()
    .regex(/^https?:\/\/[^/{}]+/, 'TILE_URL must start with http:// or https:// and a host')
    .refine(
      (url) => ['{z}', '{x}', '{y}'].every((part) => url.includes(part)),
      'TILE_URL must contain {z}, {x} and {y}, e.g. https://tiles.example.org/{z}/{x}/{y}.png',
    )
    .optional(),
  TILE_ATTRIBUTION: z.string().max(200, 'TILE_ATTRIBUTION must be at most 200 characters').optional(),
});

/** Settings production cannot do without (development has safe stand-ins); checked beside the schema. */
function missingInProduction(env: NodeJS.ProcessEnv): string[] {
  if (env.NODE_ENV !== 'production') return [];
  const lines: string[] = [];
  if (!env.SESSION_SECRET) lines.push('  SESSION_SECRET: SESSION_SECRET is required in production');
  if (!env.SMTP_URL) lines.push('  SMTP_URL: SMTP_URL is required in production');
  return lines;
}

/** The server's settings, parsed from the environment. */
export interface ServerConfig {
  databaseUrl: string;
  port: number;
  host: string;
  /** Folder of the built web site to serve beside the API; the API alone when absent. */
  webDist: string | undefined;
  environment: 'development' | 'test' | 'production';
  sessionSecret: string;
  cookieSecure: boolean;
  /** The SMTP server to send through; when absent (development), a local fake SMTP server is started. */
  smtpUrl: string | undefined;
  mailFrom: string;
  /** Base of links in e-mails; defaults to http://HOST:PORT. */
  publicUrl: string;
  uploadLimitBytes: number;
  logLevel: string;
  /** XYZ template ({z}/{x}/{y}) of background map tiles for the plan view; none when absent. */
  tileUrl: string | undefined;
  /** Credit shown over the tiles. */
  tileAttribution: string | undefined;
}

/** Thrown with every problem in the environment listed, one per line. */
export class ConfigError extends Error {
  override readonly name = 'ConfigError';
}

/** Parses the environment; throws `ConfigError` listing every problem at once. */
export function parseConfig(env: NodeJS.ProcessEnv): ServerConfig {
  const parsed = ConfigSchema.safeParse(env);
  const lines = [
    ...(parsed.success ? [] : parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`)),
    ...missingInProduction(env),
  ];
  if (!parsed.success || lines.length > 0)
    throw new ConfigError(`The server's environment is not usable:\n${lines.join('\n')}`);
  const c = parsed.data;
  return {
    databaseUrl: c.DATABASE_URL,
    port: c.PORT,
    host: c.HOST,
    webDist: c.WEB_DIST,
    environment: c.NODE_ENV,
    sessionSecret: c.SESSION_SECRET ?? DEVELOPMENT_SESSION_SECRET,
    // Secure cookies by default in production (served over TLS); COOKIE_SECURE overrides either way.
    cookieSecure: c.COOKIE_SECURE === undefined ? c.NODE_ENV === 'production' : c.COOKIE_SECURE === 'true',
    smtpUrl: c.SMTP_URL,
    mailFrom: c.MAIL_FROM,
    publicUrl: (c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}`).replace(/\/+$/, ''),
    uploadLimitBytes: Math.round(c.UPLOAD_LIMIT_MB * 1024 * 1024),
    logLevel: c.LOG_LEVEL,
    tileUrl: c.TILE_URL,
    tileAttribution: c.TILE_ATTRIBUTION,
  };
}
