import { stringifyWithNonFinite } from '@shared/json-numbers.ts';
import type { TrialDetail } from '@shared/api/trials.ts';
import { trialCsvHref } from './trials.queries.ts';

const linkClass = 'rounded border border-ink/40 px-3 py-1.5 text-sm hover:bg-paper-deep';

/** Export as JSON (the report as the API gave it) or CSV (the API's own export). */
export function ExportLinks({ trial }: { trial: TrialDetail }) {
  const downloadJson = () => {
    const blob = new Blob([stringifyWithNonFinite(trial, 2)], { type: 'application/json' });
    const url = URL.createObjectURL(blob);
    const a = document.createElement('a');
    a.href = url;
    a.download = `trial-${trial.id}.json`;
    a.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  };
  return (
    <>
      <button type="button" onClick={downloadJson} className={linkClass}>
        Export JSON
      </button>
      <a href={trialCsvHref(trial.id)} download={`trial-${trial.id}.csv`} className={linkClass}>
        Export CSV
      </a>
    </>
  );
}
