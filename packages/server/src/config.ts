import { z } from 'zod';

const ConfigSchema = z.object({
  DATABASE_URL: z
    .string({ error: 'DATABASE_URL is required (npm start sets it; e.g. postgres://app@127.0.0.1:54321/leadline)' })
    .regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must start with postgres:// or postgresql://'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  HOST: z.string().min(1).default('127.0.0.1'),
  WEB_DIST: z.string().optional(),
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
});

/** The server's settings, parsed from the environment. */
export interface ServerConfig {
  databaseUrl: string;
  port: number;
  host: string;
  /** Folder of the built web site to serve beside the API; the API alone when absent. */
  webDist: string | undefined;
  environment: 'development' | 'test' | 'production';
}

/** Thrown with every problem in the environment listed, one per line. */
export class ConfigError extends Error {
  override readonly name = 'ConfigError';
}

/** Parses the environment; throws `ConfigError` listing every problem at once. */
export function parseConfig(env: NodeJS.ProcessEnv): ServerConfig {
  const parsed = ConfigSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new ConfigError(`The server's environment is not usable:\n${lines.join('\n')}`);
  }
  const c = parsed.data;
  return {
    databaseUrl: c.DATABASE_URL,
    port: c.PORT,
    host: c.HOST,
    webDist: c.WEB_DIST,
    environment: c.NODE_ENV,
  };
}
