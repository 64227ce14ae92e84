/**
 * `npm run bench` runs every benchmark and writes benchmarks/results/<name>.json;
 * `npm run bench -- <name> …` runs the named ones; `--smoke` runs them at tiny sizes with one
 * repeat and writes nothing (the vitest smoke test does the same in-process). One summary table
 * at the end. Start Node with the flags in package.json's bench script (isolates need them).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import { runBenchmark, type BenchmarkResult } from './benchmark.ts';
import { benchmarks } from './registry.ts';
import { fmt } from './measure.ts';

function parse(argv: string[]): { smoke: boolean; names: string[] } {
  const smoke = argv.includes('--smoke');
  const names = argv.filter((a) => !a.startsWith('--'));
  const known = benchmarks.map((b) => b.name);
  const unknown = names.filter((n) => !known.includes(n));
  if (unknown.length > 0) {
    console.error(`Unknown benchmark(s): ${unknown.join(', ')}. Known: ${known.join(', ')}.`);
    process.exit(2);
  }
  return { smoke, names: names.length > 0 ? names : known };
}

function printSummary(results: BenchmarkResult[]): void {
  const lines: string[][] = [['benchmark', 'measure', 'value']];
  for (const r of results) {
    for (const [label, value] of r.summary) lines.push([r.name, label, value]);
    for (const g of r.goals)
      lines.push([
        r.name,
        `goal: ${g.goal} ${g.kind === 'min' ? '≥' : '≤'} ${g.target}`,
        `${fmt(g.measured)} ${g.met ? 'MET' : 'NOT MET'}`,
      ]);
    const failed = r.checks.filter((c) => !c.passed);
    lines.push([
      r.name,
      'correctness checks',
      failed.length === 0
        ? `${r.checks.length} passed`
        : `${failed.length} FAILED: ${failed.map((c) => c.name).join('; ')}`,
    ]);
    lines.push([
      r.name,
      'wall time',
      `${fmt(r.wallMs / 1000)} s, load ${r.loadAverage.start.map((v) => v.toFixed(1)).join('/')}`,
    ]);
  }
  const widths = [0, 1].map((c) => Math.max(...lines.map((l) => l[c]!.length)));
  for (const l of lines)
    console.log(`${l[0]!.padEnd(widths[0]!)}  ${l[1]!.padEnd(widths[1]!)}  ${l[2]}`);
}

async function main(): Promise<void> {
  const { smoke, names } = parse(process.argv.slice(2));
  const outDir = fileURLToPath(new URL('./results/', import.meta.url));
  console.log(
    `${os.cpus()[0]?.model ?? 'unknown CPU'}, ${os.cpus().length} cores; load ${os
      .loadavg()
      .map((v) => v.toFixed(2))
      .join(' ')}${smoke ? '; smoke mode' : ''}`,
  );
  const results: BenchmarkResult[] = [];
  for (const name of names) {
    const benchmark = benchmarks.find((b) => b.name === name)!;
    console.log(`${name}: ${benchmark.description}`);
    const result = await runBenchmark(benchmark, { smoke, log: (line) => console.log(line) });
    results.push(result);
    if (!smoke) {
      mkdirSync(outDir, { recursive: true });
      writeFileSync(`${outDir}${name}.json`, `${JSON.stringify(result, null, 2)}\n`);
    }
  }
  printSummary(results);
  if (results.some((r) => r.checks.some((c) => !c.passed))) process.exitCode = 1;
}

await main();
