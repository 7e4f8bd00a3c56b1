import { planSeason, simulatePlannedDive } from '@leadline/core';
import { afterAll, describe, expect, it } from 'vitest';
import { IN_THREAD_COMPUTE } from '../services/processing-service.js';
import { createThreadCompute } from './processing-threads.js';

function simulatedLog(seed: number): { fileName: string; content: Uint8Array } {
  const [planned] = planSeason({ seed, dives: 1, diveMinutes: 15, dialect: 'csv' });
  const file = planned === undefined ? undefined : simulatePlannedDive(planned).files[0];
  if (file === undefined) throw new Error('no simulated log');
  return { fileName: file.name.split('/').pop() ?? file.name, content: Buffer.from(file.text) };
}

const SETTINGS = { auditProfile: 'inspection-rov', auditSetup: {}, resolveSetup: null };
const PLACE = { timeZone: 'UTC', inputCrs: null };

describe('createThreadCompute', () => {
  const threads = createThreadCompute();
  afterAll(() => threads.close());

  it('reads, splits, audits and summarises a log on a worker thread exactly as in this thread', async () => {
    await threads.ready();
    const input = { ...SETTINGS, ...PLACE, ...simulatedLog(41) };
    const here = await IN_THREAD_COMPUTE.process(input);
    const there = await threads.process(input);
    if (!here.ok) throw new Error(here.permanent);
    expect(here.value.length).toBeGreaterThanOrEqual(1);
    // Everything stored comes back equal: fix columns, flags, findings, summary and report.
    expect(there).toEqual(here);
    const [dive] = here.value;
    expect(dive?.vehicle.length).toBeGreaterThan(500);
    expect(dive?.result.flags).toBeInstanceOf(Uint16Array);
  });

  it('audits stored dives again on a worker thread exactly as in this thread', async () => {
    const processed = await IN_THREAD_COMPUTE.process({ ...SETTINGS, ...PLACE, ...simulatedLog(42) });
    if (!processed.ok) throw new Error(processed.permanent);
    const input = {
      ...SETTINGS,
      auditProfile: 'work-rov',
      fileName: 'brennvik-042.csv',
      dives: processed.value.map((d, k) => ({ diveId: `dive-${k}`, vehicle: d.vehicle, surface: d.surface })),
    };
    const here = await IN_THREAD_COMPUTE.reprocess(input);
    const there = await threads.reprocess(input);
    expect(there).toEqual(here);
    expect(there.ok && there.value[0]?.result.auditProfile).toBe('work-rov');
  });

  it('returns what retrying cannot fix as a permanent failure, from either thread', async () => {
    const unknownProfile = { ...SETTINGS, ...PLACE, ...simulatedLog(43), auditProfile: 'no-such-profile' };
    const here = await IN_THREAD_COMPUTE.process(unknownProfile);
    expect(here).toMatchObject({ ok: false, permanent: expect.stringMatching(/^audit profile: /) });
    expect(await threads.process(unknownProfile)).toEqual(here);
    const noTrack = { ...SETTINGS, ...PLACE, fileName: 'empty.csv', content: Buffer.from('time,lat,lon\n') };
    const none = await threads.process(noTrack);
    expect(none).toMatchObject({ ok: false, permanent: expect.stringMatching(/^nothing to process: /) });
  });
});
