import { useState } from 'react';
import { importKindLabels, importModes, type ImportJobDto, type ImportMode } from '@shared/schemas/import';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useCommitImport } from '../api/commit-import';
import { usePreviewImport } from '../api/preview-import';
import { ImportProgress } from './import-progress';
import { ImportCounts, PreviewTable, ProblemsTable } from './import-results';
import { ImportStatusBadge } from './import-status';
import { MappingEditor, type MappingChoice } from './mapping-editor';

const modeText: Record<ImportMode, { label: string; hint: string }> = {
  'all-or-nothing': { label: 'All or nothing', hint: 'Every row is written in one transaction, or none is if any row has a problem.' },
  'valid-only': { label: 'Only the valid rows', hint: 'The rows with problems are left out and given back as a spreadsheet with a reason column.' },
};

function asApiError(error: unknown): ApiError | null {
  if (!error) return null;
  return error instanceof ApiError ? error : new ApiError(0, 'network', 'The server could not be reached. Check your connection and try again.');
}

/** One import from mapping to commit: check the rows, read the problems, then write. */
export function ImportWorkspace({ job }: { job: ImportJobDto }) {
  const preview = usePreviewImport();
  const commit = useCommitImport();
  const [mode, setMode] = useState<ImportMode>(job.mode ?? 'all-or-nothing');
  const running = job.status === 'validating' || job.status === 'committing';
  const checked = job.status === 'previewed';
  const finished = job.status === 'committed';
  const canCommit = checked || (job.status === 'failed' && job.columns !== null);
  const rowsToWrite = job.counts.new + job.counts.updated;
  const blocked = mode === 'all-or-nothing' && job.counts.invalid > 0;
  const commitError = asApiError(commit.error);

  const handlePreview = (choice: MappingChoice) => {
    commit.reset();
    preview.mutate({ id: job.id, version: job.version, sheet: choice.sheet, campaignId: choice.campaignId, columns: choice.columns });
  };
  const handleCommit = () => commit.mutate({ id: job.id, version: job.version, mode });

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3 text-sm text-ink-700">
        <ImportStatusBadge status={job.status} />
        <span>
          {importKindLabels[job.kind]} from <a href={job.fileUrl} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">{job.fileName}</a>
          {job.createdBy && <> · uploaded by {job.createdBy.name}</>} · {new Date(job.createdAt).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })}
        </span>
      </div>

      {running && <ImportProgress processed={job.progress.processed} total={job.progress.total} label={job.status === 'validating' ? 'Checking rows' : 'Importing rows'} />}
      {finished && (
        <div className="space-y-3">
          <ImportProgress processed={job.progress.processed} total={job.progress.total} label="Imported" />
          <Notice tone="fine" title="Import finished">
            <p>{job.message}</p>
            {job.rejectedUrl && (
              <p className="mt-1">
                <a href={job.rejectedUrl} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
                  Download the {job.counts.invalid.toLocaleString()} rejected rows with their reasons
                </a>
              </p>
            )}
          </Notice>
        </div>
      )}
      {job.status === 'failed' && <Notice tone="danger" title="Nothing was imported">{job.message && <p>{job.message}</p>}</Notice>}

      {!finished && !running && (
        <section aria-labelledby="mapping-heading" className="space-y-3">
          <h2 id="mapping-heading" className="text-lg font-semibold">
            Map the columns
          </h2>
          <MappingEditor key={`${job.id}-${job.sheet ?? ''}`} job={job} busy={preview.isPending} error={asApiError(preview.error)} onSubmit={handlePreview} />
        </section>
      )}

      {(checked || job.status === 'failed' || finished) && job.sheet && (
        <section aria-labelledby="result-heading" className="space-y-4">
          <h2 id="result-heading" className="text-lg font-semibold">
            {finished ? 'What was imported' : 'What an import would do'}
          </h2>
          <ImportCounts counts={job.counts} />
          <ProblemsTable job={job} />
          <PreviewTable preview={job.preview} stored={finished} />
        </section>
      )}

      {canCommit && !running && (
        <section aria-labelledby="commit-heading" className="space-y-3 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
          <h2 id="commit-heading" className="text-lg font-semibold">
            Commit
          </h2>
          <fieldset className="space-y-2">
            <legend className="sr-only">How to commit</legend>
            {importModes.map((option) => (
              <label key={option} className="flex items-start gap-2 text-sm">
                <input type="radio" name="mode" value={option} checked={mode === option} onChange={() => setMode(option)} className="mt-1 accent-lagoon-600" />
                <span>
                  <span className="font-medium text-ink-900">{modeText[option].label}</span>
                  <span className="block text-ink-500">{modeText[option].hint}</span>
                </span>
              </label>
            ))}
          </fieldset>
          {blocked && (
            <Notice tone="caution" title={`${job.counts.invalid.toLocaleString()} rows have problems`}>
              <p>Fix the mapping or the file and check again, or import only the valid rows.</p>
            </Notice>
          )}
          {commitError && <Notice tone="danger" title={commitError.message} />}
          <Button variant="primary" disabled={blocked} busy={commit.isPending} onClick={handleCommit}>
            Import {rowsToWrite.toLocaleString()} {rowsToWrite === 1 ? 'row' : 'rows'}
          </Button>
        </section>
      )}
    </div>
  );
}
