import { describe, expect, it } from 'vitest';
import { ConfigError, parseConfig } from './config.js';

const BASE = { DATABASE_URL: 'postgres://app@127.0.0.1:5432/leadline' };

describe('parseConfig', () => {
  it('fills development defaults: no SMTP (the fake starts), plain cookies, links to the local address', () => {
    const config = parseConfig({ ...BASE, PORT: '8480' });
    expect(config).toMatchObject({
      environment: 'development',
      smtpUrl: undefined,
      cookieSecure: false,
      publicUrl: 'http://127.0.0.1:8480',
      uploadLimitBytes: 100 * 1024 * 1024,
    });
  });

  it('lists every missing production setting at once', () => {
    expect(() => parseConfig({ ...BASE, NODE_ENV: 'production' })).toThrow(ConfigError);
    expect(() => parseConfig({ ...BASE, NODE_ENV: 'production', UPLOAD_LIMIT_MB: 'lots' })).toThrow(
      /UPLOAD_LIMIT_MB[^\n]*\n {2}SESSION_SECRET: SESSION_SECRET is required in production\n {2}SMTP_URL: SMTP_URL is required in production$/,
    );
  });

  it('makes cookies secure in production unless told otherwise', () => {
    const production = {
      ...BASE,
      NODE_ENV: 'production',
      SESSION_SECRET: 's'.repeat(40),
      SMTP_URL: 'smtp://mail.hollowtide.example:587',
      PUBLIC_URL: 'https://leadline.hollowtide.example/',
    };
    expect(parseConfig(production)).toMatchObject({
      cookieSecure: true,
      publicUrl: 'https://leadline.hollowtide.example',
    });
    expect(parseConfig({ ...production, COOKIE_SECURE: 'false' }).cookieSecure).toBe(false);
  });
});
