import { readFileSync } from 'node:fs';
import { stringifyWithNonFinite } from '@shared/json-numbers.ts';
import { runTrial, type TrialProgress } from '../trial.ts';
import { formatReport } from './format-report.ts';
import { loadSet } from './load-set.ts';
import { parseEvaluateArgs, usage, UsageError, type EvaluateOptions } from './parse-args.ts';

/** Longest kernel source the command line accepts (bytes). */
const MAX_SOURCE_BYTES = 512 * 1024;

function readSource(file: string): string {
  const text = readFileSync(file, 'utf8');
  if (Buffer.byteLength(text) > MAX_SOURCE_BYTES)
    throw new Error(`${file} is larger than ${MAX_SOURCE_BYTES} bytes`);
  return text;
}

function progressPrinter(): (p: TrialProgress) => void {
  const tty = process.stderr.isTTY;
  let lastPhase = '';
  let lastPrint = 0;
  return (p) => {
    const now = Date.now();
    if (tty) {
      process.stderr.write(
        `\r\x1b[2K[${p.phase}] ${p.done}/${p.total}${p.label ? ` ${p.label}` : ''}`,
      );
      if (p.phase === 'verdict') process.stderr.write('\r\x1b[2K');
    } else if (p.phase !== lastPhase || now - lastPrint > 5000) {
      process.stderr.write(`[${p.phase}] ${p.done}/${p.total}${p.label ? ` ${p.label}` : ''}\n`);
      lastPrint = now;
    }
    lastPhase = p.phase;
  };
}

async function main(argv: string[]): Promise<number> {
  let options: EvaluateOptions;
  try {
    options = parseEvaluateArgs(argv);
  } catch (err) {
    if (err instanceof UsageError) {
      if (err.message) process.stderr.write(`error: ${err.message}\n\n`);
      process.stderr.write(`${usage}\n`);
      return 2;
    }
    throw err;
  }
  let candidateSource: string;
  let incumbentSource: string | null;
  let loaded;
  try {
    candidateSource = readSource(options.kernelPath);
    incumbentSource = options.againstPath ? readSource(options.againstPath) : null;
    loaded = loadSet(options.set);
  } catch (err) {
    process.stderr.write(`error: ${(err as Error).message}\n`);
    return 2;
  }
  const report = await runTrial({
    routine: options.routine,
    candidateSource,
    incumbentSource,
    setName: loaded.set.name,
    matrices: loaded.matrices,
    timingSizes: loaded.set.timingSizes,
    timing: options.timing,
    matricesMs: loaded.ms,
    ...(options.callTimeoutMs !== undefined ? { callTimeoutMs: options.callTimeoutMs } : {}),
    onProgress: progressPrinter(),
  });
  process.stdout.write(
    options.json ? `${stringifyWithNonFinite(report, 2)}\n` : `${formatReport(report)}\n`,
  );
  return report.verdict.passed ? 0 : 1;
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    process.stderr.write(`error: ${(err as Error).stack ?? String(err)}\n`);
    process.exitCode = 2;
  },
);
