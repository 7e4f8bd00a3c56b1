// `npm run bench`: speed figures for the hot paths. Each benchmark prints what it measured; none is a test.
// No benchmark exists yet: the readers, reprojection and geodesy issues add theirs here.
const benchmarks: Array<{ name: string; run: () => Promise<string> }> = [];

// Simulator (issue 3): a 250-dive season at 1 Hz with 2-hour dives (~1.8 M vehicle fixes), written to disk
// by `leadline simulate` on all cores, in under a minute. Kept in the temp folder for other benchmarks to read.
benchmarks.push({
  name: 'simulate a 250-dive season, 2-hour dives at 1 Hz, files written',
  run: async () => {
    const { availableParallelism, tmpdir } = await import('node:os');
    const { join } = await import('node:path');
    const { runSimulate } = await import('../packages/cli/src/commands/simulate.js');
    const out = join(tmpdir(), 'leadline-bench', 'season-250-dives-120-min-seed-1');
    const jobs = availableParallelism();
    const lines: string[] = [];
    const io = { stdout: (t: string) => lines.push(t), stderr: (t: string) => lines.push(t), isTty: false };
    const t0 = performance.now();
    const code = await runSimulate(
      { out, dives: 250, seed: 1, diveMinutes: 120, jobs, json: true, quiet: false, progress: false, force: true },
      io,
    );
    const seconds = (performance.now() - t0) / 1000;
    if (code !== 0) return `failed with exit code ${code}: ${lines.join('').trim()}`;
    const report = JSON.parse(lines.join('')) as { vehicleFixes: number; surfaceFixes: number; files: string[] };
    const peakMb = process.resourceUsage().maxRSS / 1024;
    return `${seconds.toFixed(1)} s wall (target < 60 s) on ${jobs} jobs, ${(report.vehicleFixes / 1e6).toFixed(2)} M vehicle + ${(report.surfaceFixes / 1e6).toFixed(2)} M surface fixes, ${Math.round(report.vehicleFixes / seconds)} vehicle fixes/s, ${report.files.length} files in ${out}, peak RSS ${peakMb.toFixed(0)} MB`;
  },
});

if (benchmarks.length === 0) {
  process.stdout.write(
    'bench: no benchmarks yet (they arrive with the readers, reprojection and geodesy work); nothing measured.\n',
  );
}
for (const benchmark of benchmarks) {
  process.stdout.write(`${benchmark.name}: ${await benchmark.run()}\n`);
}
