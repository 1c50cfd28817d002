import { useState } from 'react';
import type { ImportCountsDto, ImportJobDto, ImportPreviewRowDto } from '@shared/schemas/import';
import { Button } from '@/components/ui/button';
import { importProblemsPageSize, useImportProblems } from '../api/get-import-problems';

const outcomeText: Record<ImportPreviewRowDto['outcome'], { icon: string; label: string }> = {
  new: { icon: '+', label: 'new' },
  updated: { icon: '✎', label: 'updated' },
  unchanged: { icon: '=', label: 'unchanged' },
  invalid: { icon: '⚠', label: 'invalid' },
};

/** What committing would do (or did), row by row. */
export function ImportCounts({ counts }: { counts: ImportCountsDto }) {
  const tiles: [keyof ImportCountsDto, string, string][] = [
    ['new', 'New', 'border-lagoon-300'],
    ['updated', 'Updated', 'border-lagoon-300'],
    ['unchanged', 'Unchanged', 'border-paper-300'],
    ['invalid', 'Invalid', counts.invalid > 0 ? 'border-signal-danger' : 'border-paper-300'],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4" aria-label="Row counts">
      {tiles.map(([key, label, border]) => (
        <div key={key} className={`rounded-lg border-l-4 bg-white px-4 py-3 shadow-card ${border}`}>
          <dt className="text-xs font-medium uppercase tracking-wide text-ink-500">
            <span aria-hidden>{outcomeText[key].icon} </span>
            {label}
          </dt>
          <dd className="numeric text-left font-mono text-2xl font-semibold text-ink-900">{counts[key].toLocaleString()}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Every problem with its row, column and reason, a page at a time. */
export function ProblemsTable({ job }: { job: ImportJobDto }) {
  const [page, setPage] = useState(1);
  const problems = useImportProblems(job.id, page, job.version);
  // The job's own count is current; a page of problems may still be loading.
  const total = job.problemCount;
  const rows = problems.data?.rows ?? (page === 1 ? job.problems.slice(0, importProblemsPageSize) : []);
  const pageCount = Math.max(1, Math.ceil(total / importProblemsPageSize));
  if (total === 0) return null;
  return (
    <section aria-label="Problems" className="space-y-2">
      <h3 className="font-semibold text-ink-900">
        <span aria-hidden className="text-signal-danger">⚠ </span>
        {total.toLocaleString()} {total === 1 ? 'problem' : 'problems'}
      </h3>
      <div className="overflow-x-auto rounded-lg border border-signal-danger bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-signal-danger-soft text-left text-ink-700">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">Row</th>
              <th scope="col" className="px-3 py-2 font-semibold">Column</th>
              <th scope="col" className="px-3 py-2 font-semibold">Problem</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-100">
            {rows.map((problem, index) => (
              <tr key={`${problem.row}-${problem.field}-${index}`}>
                <td className="numeric px-3 py-1.5 font-mono">{problem.row ?? '—'}</td>
                <td className="px-3 py-1.5">{problem.column ?? 'the row'}</td>
                <td className="px-3 py-1.5 text-ink-700">{problem.message}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {pageCount > 1 && (
        <nav aria-label="Pages of problems" className="flex items-center gap-2 text-sm">
          <Button disabled={page <= 1} onClick={() => setPage(page - 1)}>
            ← Earlier rows
          </Button>
          <span className="text-ink-600">
            page {page} of {pageCount}
          </span>
          <Button disabled={page >= pageCount} onClick={() => setPage(page + 1)}>
            Later rows →
          </Button>
        </nav>
      )}
    </section>
  );
}

function show(value: string | number | boolean | null): string {
  if (value === null) return '';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') return Number.isInteger(value) || Math.abs(value) >= 0.01 ? String(Number(value.toPrecision(6))) : value.toExponential(3);
  return value;
}

/** The first rows as they will be stored, in the stored units. */
export function PreviewTable({ preview, stored }: { preview: ImportJobDto['preview']; stored: boolean }) {
  if (preview.rows.length === 0) return null;
  return (
    <section aria-label="Preview" className="space-y-2">
      <h3 className="font-semibold text-ink-900">{stored ? 'The first rows as stored' : 'The first rows as they will be stored'}</h3>
      <div className="overflow-x-auto rounded-lg border border-paper-200 bg-white shadow-card">
        <table className="min-w-full text-sm">
          <thead className="bg-paper-50 text-left text-ink-700">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">Row</th>
              <th scope="col" className="px-3 py-2 font-semibold">Outcome</th>
              {preview.columns.map((column) => (
                <th key={column} scope="col" className="whitespace-nowrap px-3 py-2 font-semibold">
                  {column}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-100">
            {preview.rows.map((row) => (
              <tr key={row.row}>
                <td className="numeric px-3 py-1.5 font-mono">{row.row}</td>
                <td className="whitespace-nowrap px-3 py-1.5">
                  <span aria-hidden>{outcomeText[row.outcome].icon} </span>
                  {outcomeText[row.outcome].label}
                </td>
                {preview.columns.map((column) => {
                  const value = row.values[column] ?? null;
                  return (
                    <td key={column} className={`whitespace-nowrap px-3 py-1.5 ${typeof value === 'number' ? 'numeric font-mono' : ''}`}>
                      {show(value)}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
