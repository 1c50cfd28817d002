import { createColumnHelper, getCoreRowModel, useReactTable, type OnChangeFn, type RowSelectionState } from '@tanstack/react-table';
import { useEffect, useMemo, useRef } from 'react';
import { Link } from 'react-router-dom';
import type { KineticModelName } from '@shared/schemas/assay';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { DataTable } from '@/components/ui/data-table';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { kmWithError, withError } from '../format-with-error';

const column = createColumnHelper<MeasurementDto>();

const modelNames: Record<KineticModelName, string> = {
  'michaelis-menten': 'Michaelis–Menten',
  'substrate-inhibition': 'Substrate inhibition',
  hill: 'Hill',
};

function SelectBox({ checked, indeterminate = false, disabled = false, label, onChange }: {
  checked: boolean;
  indeterminate?: boolean;
  disabled?: boolean;
  label: string;
  onChange: (checked: boolean) => void;
}) {
  const ref = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (ref.current) ref.current.indeterminate = indeterminate;
  }, [indeterminate]);
  return (
    <input
      ref={ref}
      type="checkbox"
      aria-label={label}
      className="size-4 accent-lagoon-700"
      checked={checked}
      disabled={disabled}
      onChange={(event) => onChange(event.target.checked)}
    />
  );
}

export interface ReviewTableProps {
  measurements: MeasurementDto[];
  selection: RowSelectionState;
  onSelectionChange: OnChangeFn<RowSelectionState>;
}

/** The submitted measurements with what a reviewer weighs: conditions, parameters with errors, checks. */
export function ReviewTable({ measurements, selection, onSelectionChange }: ReviewTableProps) {
  const columns = useMemo(
    () => [
      column.display({
        id: 'select',
        header: ({ table }) => (
          <SelectBox
            label="Select every measurement on this page"
            checked={table.getIsAllRowsSelected()}
            indeterminate={table.getIsSomeRowsSelected()}
            onChange={(checked) => table.toggleAllRowsSelected(checked)}
          />
        ),
        cell: ({ row }) => (
          <SelectBox
            label={`Select measurement ${row.original.id} of ${row.original.variant.label}`}
            checked={row.getIsSelected()}
            disabled={!row.getCanSelect()}
            onChange={(checked) => row.toggleSelected(checked)}
          />
        ),
      }),
      column.accessor((measurement) => measurement.variant.label, {
        id: 'variant',
        header: 'Variant',
        cell: ({ row }) => (
          <div>
            <Link to={paths.variant.href(row.original.variant.id)} className="font-mono font-semibold text-lagoon-700 hover:underline">
              {row.original.variant.label}
            </Link>
            <div className="whitespace-nowrap text-xs text-ink-500">measurement {row.original.id}</div>
          </div>
        ),
      }),
      column.accessor('conditions', {
        header: 'Conditions',
        cell: ({ getValue }) => {
          const conditions = getValue();
          return (
            <div>
              <div className="whitespace-nowrap">
                pH {conditions.ph} · {conditions.temperatureC} °C
              </div>
              <div className="max-w-48 truncate text-xs text-ink-500" title={conditions.substrate}>
                {conditions.substrate}
              </div>
            </div>
          );
        },
      }),
      column.accessor('model', {
        header: 'Model',
        cell: ({ row }) => (
          <div>
            <div className="whitespace-nowrap">{modelNames[row.original.model]}</div>
            <div className="text-xs text-ink-500">
              {row.original.source === 'entered' ? 'entered values' : `fitted to ${row.original.pointCount ?? '?'} points`}
            </div>
          </div>
        ),
      }),
      column.accessor('kcat', {
        header: 'kcat (s⁻¹)',
        cell: ({ getValue }) => <span className="whitespace-nowrap font-mono">{withError(getValue())}</span>,
        meta: { numeric: true },
      }),
      column.accessor('km', {
        header: 'Km',
        cell: ({ getValue }) => <span className="whitespace-nowrap font-mono">{kmWithError(getValue())}</span>,
        meta: { numeric: true },
      }),
      column.accessor('kcatOverKm', {
        header: 'kcat/Km (M⁻¹ s⁻¹)',
        cell: ({ getValue }) => <span className="whitespace-nowrap font-mono">{withError(getValue(), true)}</span>,
        meta: { numeric: true },
      }),
      column.accessor('completeness', {
        header: 'Reporting',
        cell: ({ getValue }) => {
          const completeness = getValue();
          return (
            <span
              className="font-mono"
              title={completeness.missing.length === 0 ? 'Every STRENDA item is reported.' : `Missing: ${completeness.missing.join(', ')}`}
            >
              {Math.round(completeness.score * 100)} %
            </span>
          );
        },
        meta: { numeric: true },
      }),
      column.display({
        id: 'checks',
        header: 'Checks',
        cell: ({ row }) => {
          const { flags, warnings, supersededById } = row.original;
          if (supersededById !== null) {
            return <span className="text-ink-600">Superseded by a refit (measurement {supersededById}); review that one.</span>;
          }
          if (flags.length === 0 && warnings.length === 0) {
            return (
              <span className="whitespace-nowrap text-signal-fine">
                <span aria-hidden>✓ </span>No concerns
              </span>
            );
          }
          return (
            <ul className="space-y-0.5">
              {flags.map((flag) => (
                <li key={flag.code} className={flag.severity === 'implausible' ? 'text-signal-danger' : 'text-signal-caution'}>
                  <span aria-hidden>{flag.severity === 'implausible' ? '⚠ ' : '! '}</span>
                  {flag.message}
                </li>
              ))}
              {warnings.map((warning) => (
                <li key={warning} className="text-ink-600">
                  <span aria-hidden>i </span>
                  {warning}
                </li>
              ))}
            </ul>
          );
        },
      }),
      column.accessor('createdAt', {
        header: 'Entered',
        cell: ({ getValue }) => <span className="whitespace-nowrap text-ink-600">{formatDate(getValue())}</span>,
      }),
    ],
    [],
  );

  const table = useReactTable({
    data: measurements,
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (measurement) => String(measurement.id),
    // A superseded measurement can no longer be approved or flagged; its refit is reviewed instead.
    enableRowSelection: (row) => row.original.supersededById === null,
    state: { rowSelection: selection },
    onRowSelectionChange: onSelectionChange,
  });

  return <DataTable table={table} caption="Submitted measurements" variant="wide" />;
}
