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

  it('takes an optional background tile template with {z}, {x} and {y} over http(s), and refuses others', () => {
    expect(parseConfig(BASE).tileUrl).toBeUndefined();
    const ok = parseConfig({
      ...BASE,
      TILE_URL: 'http://127.0.0.1:9000/{z}/{x}/{y}.png',
      TILE_ATTRIBUTION: 'Hollowtide charts',
    });
    expect(ok).toMatchObject({
      tileUrl: 'http://127.0.0.1:9000/{z}/{x}/{y}.png',
      tileAttribution: 'Hollowtide charts',
    });
    expect(() => parseConfig({ ...BASE, TILE_URL: 'http://tiles.example/{z}/{x}.png' })).toThrow(
      /TILE_URL: TILE_URL must contain \{z\}, \{x\} and \{y\}/,
    );
    expect(() => parseConfig({ ...BASE, TILE_URL: 'ftp://tiles.example/{z}/{x}/{y}.png' })).toThrow(
      /TILE_URL: TILE_URL must start with http:\/\/ or https:\/\//,
    );
  });
});
