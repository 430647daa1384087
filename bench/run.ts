// `npm run bench`: runs every bench/*.bench.ts (or the ones named on the command line) one after
// another and prints each one's report. Benchmarks measure; they never fail the build.
import { readdirSync } from 'node:fs';
import { basename, join } from 'node:path';

export interface BenchModule {
  /** Runs the benchmark and prints its own report lines. */
  run(): Promise<void> | void;
}

async function main(): Promise<void> {
  const only = process.argv.slice(2);
  const files = readdirSync(__dirname)
    .filter((f) => f.endsWith('.bench.ts'))
    .filter((f) => only.length === 0 || only.some((o) => f.startsWith(o)))
    .sort();
  for (const file of files) {
    console.log(`\n## ${basename(file, '.bench.ts')}`);
    const mod = (await import(join(__dirname, file))) as BenchModule;
    await mod.run();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
