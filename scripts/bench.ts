// `npm run bench`: speed figures for the hot paths. Each benchmark prints what it measured; none is a test.
// No benchmark exists yet: the readers, reprojection and geodesy issues add theirs here.
const benchmarks: Array<{ name: string; run: () => Promise<string> }> = [];

if (benchmarks.length === 0) {
  process.stdout.write(
    'bench: no benchmarks yet (they arrive with the readers, reprojection and geodesy work); nothing measured.\n',
  );
}
for (const benchmark of benchmarks) {
  process.stdout.write(`${benchmark.name}: ${await benchmark.run()}\n`);
}
