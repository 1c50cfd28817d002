import { useState, type FormEvent } from 'react';
import { unitsOfKind } from '@shared/imports/unit-spelling';
import { importFields, type ColumnMapping, type ImportJobDto } from '@shared/schemas/import';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import type { ApiError } from '@/lib/api-client';
import { useImportCampaignChoices } from '../api/get-campaign-choices';

export interface MappingChoice {
  sheet: string;
  campaignId: number | null;
  columns: ColumnMapping;
}

function columnLetter(index: number): string {
  let letters = '';
  for (let rest = index + 1; rest > 0; rest = Math.floor((rest - 1) / 26)) letters = String.fromCharCode(65 + ((rest - 1) % 26)) + letters;
  return letters;
}

function initialColumns(job: ImportJobDto, sheet: string): ColumnMapping {
  if (job.sheet === sheet && job.columns) return job.columns;
  return job.sheets.find((candidate) => candidate.name === sheet)?.suggested.columns ?? {};
}

const selectClass = 'w-full rounded-md border bg-white px-2 py-1.5 text-sm text-ink-900 focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200';

/**
 * Steps two and three: the sheet, and which column holds each field in which unit. Columns come
 * pre-chosen from the user's last mapping for this kind or from the header names and their units.
 */
export function MappingEditor({ job, busy, error, onSubmit }: { job: ImportJobDto; busy: boolean; error: ApiError | null; onSubmit: (choice: MappingChoice) => void }) {
  const campaigns = useImportCampaignChoices();
  const [sheet, setSheet] = useState(job.sheet ?? job.sheets[0].name);
  const [campaignId, setCampaignId] = useState<number | null>(job.campaignId);
  const [columns, setColumns] = useState<ColumnMapping>(() => initialColumns(job, sheet));
  const [showAll, setShowAll] = useState(false);
  // Optional fields without a column are folded away: a sheet rarely has more than a dozen of the thirty.
  const [initiallyMapped, setInitiallyMapped] = useState(() => new Set(Object.keys(columns)));
  const current = job.sheets.find((candidate) => candidate.name === sheet) ?? job.sheets[0];
  const fields = importFields[job.kind];
  const columnOptions = [{ value: '', label: '— not imported —' }, ...current.headers.map((header, index) => ({ value: String(index), label: `${columnLetter(index)} · ${header || '(no header)'}` }))];

  const choose = (key: string, column: string) => {
    setColumns((before) => {
      const next = { ...before };
      if (column === '') delete next[key];
      else next[key] = { column: Number(column), ...(before[key]?.unit ? { unit: before[key]!.unit } : {}) };
      return next;
    });
  };
  const chooseUnit = (key: string, unit: string) => {
    setColumns((before) => {
      const choice = before[key];
      if (!choice) return before;
      return { ...before, [key]: unit === '' ? { column: choice.column } : { column: choice.column, unit } };
    });
  };
  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    onSubmit({ sheet, campaignId, columns });
  };

  const fieldErrors = error?.fields ?? {};
  const shown = fields.filter((field) => showAll || field.required || initiallyMapped.has(field.key) || fieldErrors[`columns.${field.key}`]);
  const folded = fields.length - shown.length;
  // Where a column came from is worth saying only before the user has sent a mapping of their own.
  const sayWhereFrom = job.columns === null;
  const general = error && Object.keys(error.fields).length === 0 ? error.message : null;

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card" aria-label="Column mapping">
      <div className="grid gap-4 sm:grid-cols-2">
        {job.sheets.length > 1 ? (
          <SelectField
            label="Sheet"
            value={sheet}
            options={job.sheets.map((candidate) => ({ value: candidate.name, label: `${candidate.name} (${candidate.rowCount.toLocaleString()} rows)` }))}
            error={fieldErrors.sheet}
            onChange={(event) => {
              const next = initialColumns(job, event.target.value);
              setSheet(event.target.value);
              setColumns(next);
              setInitiallyMapped(new Set(Object.keys(next)));
            }}
          />
        ) : (
          <p className="text-sm text-ink-700">
            Sheet <span className="font-medium">{current.name}</span>, {current.rowCount.toLocaleString()} rows below the header row.
          </p>
        )}
        <SelectField
          label="Campaign of rows without one"
          value={campaignId === null ? '' : String(campaignId)}
          options={[{ value: '', label: 'Only the campaign column' }, ...(campaigns.data ?? []).map((campaign) => ({ value: String(campaign.id), label: campaign.name }))]}
          error={fieldErrors.campaignId}
          hint="Used where the sheet has no campaign column, or a cell in it is empty."
          onChange={(event) => setCampaignId(event.target.value === '' ? null : Number(event.target.value))}
        />
      </div>
      {general && <Notice tone="danger" title={general} />}
      {Object.keys(fieldErrors).some((key) => key.startsWith('columns.')) && (
        <Notice tone="danger" title="The mapping cannot be used yet">
          <p>Fix the fields marked below.</p>
        </Notice>
      )}
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm">
          <caption className="sr-only">Which column holds each field</caption>
          <thead>
            <tr className="border-b border-paper-200 text-left text-ink-700">
              <th scope="col" className="py-2 pr-3 font-semibold">Field</th>
              <th scope="col" className="py-2 pr-3 font-semibold">Column</th>
              <th scope="col" className="py-2 pr-3 font-semibold">Unit</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-100">
            {shown.map((field) => {
              const choice = columns[field.key];
              const problem = fieldErrors[`columns.${field.key}`];
              const source = current.suggested.source[field.key];
              return (
                <tr key={field.key} className="align-top">
                  <th scope="row" className="py-2 pr-3 text-left font-normal">
                    <span className="font-medium text-ink-900">{field.label}</span>
                    {field.required && (
                      <span className="ml-1.5 rounded bg-paper-100 px-1 text-xs text-ink-600">{field.key === 'campaign' ? 'required, or chosen above' : 'required'}</span>
                    )}
                    <p className="max-w-md text-xs text-ink-500">{field.hint}</p>
                  </th>
                  <td className="py-2 pr-3">
                    <select
                      aria-label={`Column for ${field.label}`}
                      aria-invalid={problem ? true : undefined}
                      value={choice ? String(choice.column) : ''}
                      onChange={(event) => choose(field.key, event.target.value)}
                      className={`${selectClass} min-w-48 ${problem ? 'border-signal-danger' : 'border-paper-300'}`}
                    >
                      {columnOptions.map((option) => (
                        <option key={option.value} value={option.value}>
                          {option.label}
                        </option>
                      ))}
                    </select>
                    {problem ? (
                      <p className="mt-1 flex items-start gap-1 text-xs text-signal-danger">
                        <span aria-hidden>⚠</span> {problem}
                      </p>
                    ) : (
                      sayWhereFrom && source && choice && <p className="mt-1 text-xs text-ink-500">{source === 'saved' ? 'as you mapped it last time' : 'found from the header'}</p>
                    )}
                  </td>
                  <td className="py-2 pr-3">
                    {field.unitKind && (
                      <select
                        aria-label={`Unit of ${field.label}`}
                        disabled={!choice}
                        value={choice?.unit ?? ''}
                        onChange={(event) => chooseUnit(field.key, event.target.value)}
                        className={`${selectClass} min-w-32 border-paper-300 disabled:bg-paper-50 disabled:text-ink-400`}
                      >
                        <option value="">{field.errorOf ? 'as its value' : 'from the header'}</option>
                        {unitsOfKind[field.unitKind].map((unit) => (
                          <option key={unit} value={unit}>
                            {unit}
                          </option>
                        ))}
                      </select>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {(folded > 0 || showAll) && (
        <Button variant="quiet" onClick={() => setShowAll(!showAll)} aria-expanded={showAll}>
          {showAll ? 'Show only the mapped and required fields' : `Show the ${folded} other fields`}
        </Button>
      )}
      <div>
        <Button type="submit" variant="primary" busy={busy}>
          Check rows
        </Button>
      </div>
    </form>
  );
}
