import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { deflateSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../support/browser.js';
import { openWatchedPage } from '../support/browser-pages.js';
import { createTestDatabase } from '../support/test-database.js';
import { startWebServer } from '../support/web-server.js';

/** The tiles' colour: a magenta no part of the plot uses. */
const TILE_RGB = [214, 64, 190] as const;

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(bytes: Buffer): number {
  let c = 0xffffffff;
  for (const byte of bytes) c = (CRC_TABLE[(c ^ byte) & 0xff] as number) ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** A solid-colour 256 × 256 RGB PNG (PNG spec, RFC 2083: IHDR, one zlib IDAT of filter-0 rows, IEND). */
function solidPng([r, g, b]: readonly [number, number, number]): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(256, 0);
  header.writeUInt32BE(256, 4);
  header.set([8, 2, 0, 0, 0], 8); // 8 bits, truecolour, deflate, no filter method choice, no interlace
  const row = Buffer.alloc(1 + 256 * 3);
  for (let x = 0; x < 256; x++) row.set([r, g, b], 1 + 3 * x);
  const pixels = Buffer.concat(Array.from({ length: 256 }, () => row));
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(pixels)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** Share of the plan canvas's pixels (from a screenshot, so a cross-origin image cannot hide them) in the tile colour. */
async function tileColourShare(page: Page): Promise<number> {
  const shot = await page.getByTestId('plan-canvas').screenshot();
  return page.evaluate(
    async ({ src, rgb }) => {
      const image = new Image();
      image.src = src;
      await image.decode();
      const canvas = document.createElement('canvas');
      canvas.width = image.naturalWidth;
      canvas.height = image.naturalHeight;
      const ctx = canvas.getContext('2d');
      if (!ctx) throw new Error('no 2-D context');
      ctx.drawImage(image, 0, 0);
      const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
      let hits = 0;
      for (let i = 0; i < data.length; i += 4)
        if (
          Math.abs((data[i] as number) - rgb[0]) <= 4 &&
          Math.abs((data[i + 1] as number) - rgb[1]) <= 4 &&
          Math.abs((data[i + 2] as number) - rgb[2]) <= 4
        )
          hits++;
      return hits / (data.length / 4);
    },
    { src: `data:image/png;base64,${shot.toString('base64')}`, rgb: TILE_RGB },
  );
}

describe('plan view background map from a configured tile server', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let web: Awaited<ReturnType<typeof startWebServer>>;
  let browser: Awaited<ReturnType<typeof launchBrowser>>;
  let tiles: Server;
  let tileBase: string;
  const tileRequests: string[] = [];

  beforeAll(async () => {
    const png = solidPng(TILE_RGB);
    tiles = createServer((req, res) => {
      tileRequests.push(req.url ?? '');
      if (/^\/\d+\/\d+\/\d+\.png$/.test(req.url ?? '')) {
        res.writeHead(200, { 'Content-Type': 'image/png', 'Content-Length': png.length });
        res.end(png);
      } else {
        res.writeHead(404).end();
      }
    });
    await new Promise<void>((resolve) => tiles.listen(0, '127.0.0.1', resolve));
    tileBase = `http://127.0.0.1:${(tiles.address() as AddressInfo).port}`;
    database = await createTestDatabase();
    web = await startWebServer(database, {
      tileUrl: `${tileBase}/{z}/{x}/{y}.png`,
      tileAttribution: 'Hollowtide test charts',
    });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await web?.close();
    await database?.drop();
    await new Promise<void>((resolve) => {
      tiles?.closeAllConnections();
      tiles?.close(() => resolve());
    });
  });

  it('draws the tiles behind the track, credits them, and asks no other host', async () => {
    const { page, requested, pageErrors } = await openWatchedPage(browser.context);

    await page.goto(`${web.baseUrl}/preview/dive?fixes=2000&seed=1`);
    const plan = page.getByTestId('plan-canvas');
    await expect.poll(() => plan.getAttribute('data-tiles-drawn'), { timeout: 45_000 }).not.toBe('0');

    // The tile server was asked for z/x/y tiles, and only for those.
    expect(tileRequests.length).toBeGreaterThan(0);
    for (const path of tileRequests) expect(path).toMatch(/^\/\d+\/\d+\/\d+\.png$/);
    // Every request went to the site itself or the configured tile server.
    for (const url of requested) expect([web.baseUrl, tileBase]).toContain(new URL(url).origin);

    // Most of the plot shows the tile colour (the track, grid and labels cover the rest).
    expect(await tileColourShare(page)).toBeGreaterThan(0.3);
    expect(await page.getByTestId('map-attribution').textContent()).toBe('Hollowtide test charts');

    // Switched off, the plot goes back to its own background.
    await page.getByRole('checkbox', { name: 'Background map' }).uncheck();
    await expect.poll(() => plan.getAttribute('data-tiles-drawn')).toBe('0');
    await expect.poll(() => tileColourShare(page)).toBeLessThan(0.01);
    expect(pageErrors).toEqual([]);
    await page.close();
  });
});
