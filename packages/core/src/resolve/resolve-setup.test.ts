import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import { parseResolveSetup, resolveSetupJsonSchema } from './resolve-setup.js';

describe('parseResolveSetup', () => {
  it('fills every default and gives every parameter a source', () => {
    const setup = parseResolveSetup({ soundSpeed: { loggedMps: 1500 } });
    expect(setup.soundSpeed).toEqual({ loggedMps: 1500, loggedSource: 'not stated' });
    expect(setup.headingOffset).toEqual({ valueDeg: 0, source: 'not stated' });
    expect(setup.declination).toEqual({ method: 'value', valueDeg: 0, source: 'not stated' });
    expect(setup.leverArm).toEqual({ forwardM: 0, starboardM: 0, downM: 0, source: 'not stated' });
    expect(setup.transceiverDraft).toEqual({ valueM: 0, source: 'not stated' });
    expect(setup.surfacePosition.method).toBe('gnss');
    expect(setup.bearingReference.value).toBe('from-log');
    expect(setup.rangeObservation.kind).toBe('slant-range');
  });

  it('keeps a full setup as given', () => {
    const input = {
      name: 'after CTD cast',
      rangeObservation: { kind: 'slant-range', source: 'log' },
      soundSpeed: {
        loggedMps: 1500,
        loggedSource: 'topside default',
        water: { method: 'unesco-1983', temperatureC: 6, salinityPsu: 33, temperatureScale: 'its90', source: 'CTD' },
      },
      bearingReference: { value: 'relative', source: 'manual' },
      headingOffset: { valueDeg: -1.2, source: 'alignment run' },
      declination: { method: 'wmm', source: 'WMM2025' },
      leverArm: { forwardM: 1, starboardM: 2, downM: 3, source: 'vessel survey' },
      transceiverDraft: { valueM: 1.5, source: 'tape' },
      surfacePosition: { method: 'fixed', latDeg: 60, lonDeg: 5, headingTrueDeg: 90, source: 'quay survey' },
      loggedWith: { headingOffsetDeg: 0, declinationDeg: 0, source: 'topside' },
    };
    expect(parseResolveSetup(input)).toEqual(input);
  });

  it('names every bad key', () => {
    expect(() => parseResolveSetup({})).toThrow(/soundSpeed/);
    expect(() => parseResolveSetup({ soundSpeed: { loggedMps: 1500, water: { method: 'guess' } } })).toThrow(
      /soundSpeed\.water\.method/,
    );
    expect(() =>
      parseResolveSetup({
        soundSpeed: {
          loggedMps: 1500,
          water: {
            method: 'profile',
            samples: [
              { depthM: 10, soundSpeedMps: 1480 },
              { depthM: 5, soundSpeedMps: 1470 },
            ],
          },
        },
      }),
    ).toThrow(/profile depths must increase/);
    expect(() => parseResolveSetup({ soundSpeed: { loggedMps: 1500 }, surplus: 1 })).toThrow(InvalidArgumentError);
    expect(() =>
      parseResolveSetup({
        soundSpeed: { loggedMps: 1500 },
        surfacePosition: { method: 'fixed', latDeg: 95, lonDeg: 0 },
      }),
    ).toThrow(/surfacePosition\.latDeg/);
  });
});

describe('resolveSetupJsonSchema', () => {
  it('describes the same setup: soundSpeed required, methods and defaults listed', () => {
    const schema = resolveSetupJsonSchema() as {
      required: string[];
      properties: Record<string, { default?: unknown }>;
    };
    expect(schema.required).toEqual(['soundSpeed']);
    expect(schema.properties.headingOffset?.default).toEqual({ valueDeg: 0, source: 'not stated' });
    expect(JSON.stringify(schema)).toContain('"fresh-bilaniuk-wong-1993"');
  });
});
