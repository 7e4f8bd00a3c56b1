import { describe, expect, it } from 'vitest';
import { readColumnChoice, writeColumnChoice } from './column-choice';

function memoryStorage(initial: Record<string, string> = {}) {
  const items = new Map(Object.entries(initial));
  return { getItem: (k: string) => items.get(k) ?? null, setItem: (k: string, v: string) => void items.set(k, v) };
}

describe('readColumnChoice', () => {
  it('shows the usual columns and hides the profile and log file by default', () => {
    const choice = readColumnChoice(memoryStorage());
    expect(choice.start).toBe(true);
    expect(choice.verdict).toBe(true);
    expect(choice.profile).toBe(false);
    expect(choice.log).toBe(false);
  });

  it('ignores bad JSON and unknown or non-boolean entries', () => {
    expect(readColumnChoice(memoryStorage({ 'leadline.diveTable.columns': '{oops' })).start).toBe(true);
    const choice = readColumnChoice(
      memoryStorage({ 'leadline.diveTable.columns': JSON.stringify({ start: 'no', colour: false, fixes: false }) }),
    );
    expect(choice.start).toBe(true);
    expect(choice.fixes).toBe(false);
    expect(choice).not.toHaveProperty('colour');
  });
});

describe('writeColumnChoice', () => {
  it('remembers a choice that readColumnChoice gives back', () => {
    const storage = memoryStorage();
    writeColumnChoice(storage, { ...readColumnChoice(storage), duration: false, log: true });
    const again = readColumnChoice(storage);
    expect(again.duration).toBe(false);
    expect(again.log).toBe(true);
  });

  it('survives a storage that refuses writes', () => {
    const refusing = {
      setItem: () => {
        throw new Error('QuotaExceededError');
      },
    };
    expect(() => writeColumnChoice(refusing, { start: false })).not.toThrow();
  });
});
