import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import type { MatrixSet } from '@sandbox/matrices/sets.ts';
import { runTrial } from '@sandbox/trial.ts';
import { materializeSet } from '@sandbox/trial/materialize-set.ts';
import type { TrialReport } from '@shared/trial-report.ts';

/** The kernels of the seeded history: the starter is the incumbent, the example a candidate. */
export const incumbentSource = readKernelSource('starters/lu-partial-pivoting.ts');
export const candidateSource = readKernelSource('examples/lu-partial-pivoting-right-looking.ts');

/** Real trial reports the seeded trials copy: a candidate trial and a drift check's re-run. */
export interface TrialTemplates {
  candidate: TrialReport;
  driftCheck: TrialReport;
}

/**
 * Runs two real trials through the engine on `set`, as the worker would: a candidate beside
 * the incumbent, and the incumbent alone (what a drift check runs). Their per-matrix and timing
 * results are the shape and size of every seeded trial's. A short timing budget keeps this to
 * seconds; the rows it yields are the same size as with the worker's budget.
 */
export async function runTemplateTrials(
  set: MatrixSet,
  timingBudgetMs: number,
): Promise<TrialTemplates> {
  const run = async (candidate: string, incumbent: string | null) => {
    const t0 = performance.now();
    const matrices = materializeSet(set, () => '');
    return runTrial({
      routine: 'lu-partial-pivoting',
      candidateSource: candidate,
      incumbentSource: incumbent,
      setName: set.name,
      matrices,
      matricesMs: performance.now() - t0,
      timingSizes: set.timingSizes,
      timingBudgetMs,
    });
  };
  return {
    candidate: await run(candidateSource, incumbentSource),
    driftCheck: await run(incumbentSource, null),
  };
}
