import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { z } from 'zod';

/** The configuration file's default name, looked for in the working folder. */
export const CONFIG_FILE = 'leadline.config.json';

/**
 * The shape of `leadline.config.json`. Profiles and setups are checked again, field by field, by
 * the core schemas of the audit and re-solve stages when a verb uses them.
 */
export const ConfigSchema = z.strictObject({
  $schema: z.string().optional(),
  defaults: z
    .strictObject({
      profile: z.string().optional(),
      crs: z.string().optional(),
      tz: z.string().optional(),
      jobs: z.number().int().positive().optional(),
      setup: z.string().optional(),
    })
    .optional(),
  columns: z.record(z.string(), z.record(z.string(), z.string())).optional(),
  /**
   * Read settings for the logs under a folder (relative to this file), e.g. one site's time zone and
   * CRS, so one command can take a season from several sites; the command line's own flags win.
   */
  folders: z
    .record(
      z.string(),
      z.strictObject({
        tz: z.string().optional(),
        inputCrs: z.string().optional(),
        columns: z.union([z.string(), z.record(z.string(), z.string())]).optional(),
      }),
    )
    .optional(),
  profiles: z.record(z.string(), z.record(z.string(), z.unknown())).optional(),
  setups: z.record(z.string(), z.record(z.string(), z.unknown())).optional(),
});

export type LeadlineConfig = z.infer<typeof ConfigSchema>;

/** A configuration file that cannot be used; the message names the file and every bad key. */
export class ConfigFileError extends Error {
  override readonly name = 'ConfigFileError';
}

/**
 * Loads the configuration: the file given with `--config` (which must exist), else
 * `leadline.config.json` in `cwd` when present, else an empty configuration.
 */
export async function loadConfig(
  explicitPath: string | undefined,
  cwd: string = process.cwd(),
): Promise<{ config: LeadlineConfig; file?: string }> {
  const path = resolve(cwd, explicitPath ?? CONFIG_FILE);
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (error) {
    if (explicitPath === undefined && (error as NodeJS.ErrnoException).code === 'ENOENT') return { config: {} };
    throw new ConfigFileError(`${path}: cannot read the configuration file (${(error as Error).message})`);
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    throw new ConfigFileError(`${path}: not valid JSON (${(error as Error).message})`);
  }
  const parsed = ConfigSchema.safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `${issue.path.join('.') || '(top level)'}: ${issue.message}`);
    throw new ConfigFileError(`${path}: ${problems.join('; ')}`);
  }
  return { config: parsed.data, file: path };
}
