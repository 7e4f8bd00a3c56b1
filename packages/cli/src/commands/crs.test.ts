import { describe, expect, it } from 'vitest';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { type CrsReportEntry, runCrs } from './crs.js';

function capture(): CliIo & { out: () => string; err: () => string } {
  const out: string[] = [];
  const err: string[] = [];
  return {
    isTty: false,
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    out: () => out.join(''),
    err: () => err.join(''),
  };
}

describe('runCrs', () => {
  it('finds CRSs by name words', () => {
    const io = capture();
    expect(runCrs(['etrs89', 'utm', '32N'], { limit: 3, json: true }, io)).toBe(0);
    const entries = JSON.parse(io.out()) as CrsReportEntry[];
    expect(entries[0]?.code).toBe('EPSG:25832');
    expect(entries.length).toBeLessThanOrEqual(3);
  });

  it('shows one code with its method and accuracy (EPSG:27700 falls back to a Helmert shift)', () => {
    const io = capture();
    expect(runCrs(['EPSG:27700'], { limit: 20, json: false }, io)).toBe(0);
    expect(io.out()).toMatch(/EPSG:27700\tprojected\t5 m\tOSGB36 \/ British National Grid/);
    expect(io.out()).toMatch(/Helmert/);
  });

  it('lists the CRSs covering a position with --at', () => {
    const io = capture();
    expect(runCrs([], { at: '-17.5,179.99', limit: 200, json: true }, io)).toBe(0);
    const codes = (JSON.parse(io.out()) as CrsReportEntry[]).map((e) => e.code);
    expect(codes).toContain('EPSG:32760');
  });

  it('refuses no words and no --at, both, a malformed position and an unusable code, with exit 2', () => {
    for (const [words, at, message] of [
      [[], undefined, /give name words or a code, or --at/],
      [['utm'], '1,2', /not both/],
      [[], '91,0', /expected lat,lon/],
      [['EPSG:5703'], undefined, /vertical/],
    ] as const) {
      const io = capture();
      expect(runCrs(words, { ...(at === undefined ? {} : { at }), limit: 5, json: false }, io)).toBe(2);
      expect(io.err()).toMatch(message);
    }
  });

  it('says when nothing is found and still exits 0', () => {
    const io = capture();
    expect(runCrs(['qqqzzz'], { limit: 5, json: false }, io)).toBe(0);
    expect(io.err()).toMatch(/nothing found/);
  });

  it('is registered on the program', async () => {
    const io = capture();
    expect(await main(['crs', 'british', 'national', 'grid', '--json'], io)).toBe(0);
    expect((JSON.parse(io.out()) as CrsReportEntry[]).map((e) => e.code)).toContain('EPSG:27700');
  });
});
