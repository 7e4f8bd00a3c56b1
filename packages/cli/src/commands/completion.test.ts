import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import type { CliIo } from '../io.js';
import { main } from '../main.js';

function capture(): CliIo & { text: () => string } {
  const out: string[] = [];
  return { isTty: false, stdout: (t) => out.push(t), stderr: () => {}, text: () => out.join('') };
}

describe('runCompletion', () => {
  it('writes a bash script that bash accepts and that completes the verbs', async () => {
    const io = capture();
    expect(await main(['completion', 'bash'], io)).toBe(0);
    const script = io.text();
    expect(script).toContain('complete -o filenames -F _leadline leadline');
    // Load it into a real bash and ask it to complete "leadline comp".
    const completed = execFileSync(
      'bash',
      ['-c', `${script}\nCOMP_WORDS=(leadline comp); COMP_CWORD=1; _leadline; echo "\${COMPREPLY[@]}"`],
      { encoding: 'utf8' },
    );
    expect(completed.trim()).toBe('completion');
  });

  it('writes a zsh script listing every verb', async () => {
    const io = capture();
    expect(await main(['completion', 'zsh'], io)).toBe(0);
    expect(io.text()).toMatch(/^#compdef leadline/);
    expect(io.text()).toContain("'completion:print a shell completion script for bash or zsh'");
  });

  it('refuses an unknown shell as a usage error', async () => {
    const io = capture();
    expect(await main(['completion', 'fish'], io)).toBe(2);
  });
});
