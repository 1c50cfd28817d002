import type { ClipboardEvent } from 'react';
import { Button } from '@/components/ui/button';
import { splitPastedText, type ParsedBlock } from '../lib/parse-pasted-block';
import { fillCells, gridFromBlock, maxReplicates, pointKey, removeRow, setCell, setReplicateCount, type CellProblem, type PointGridState } from '../lib/point-grid';

export interface PointGridEditorProps {
  state: PointGridState;
  onChange: (state: PointGridState) => void;
  /** Column titles with units, e.g. `[S] (mM)` and `v₀ (µM/min)`. */
  xTitle: string;
  yTitle: string;
  problems: readonly CellProblem[];
  /** Reads a pasted block (rate or pH block). */
  parse: (text: string) => ParsedBlock;
  /** Told about a block that replaced the grid, so units from its header can be taken over. */
  onBlockPasted: (block: ParsedBlock) => void;
  /** Asks to exclude a point (the page opens the reason dialog) or to include it again. */
  onToggleExclusion: (key: string) => void;
}

/**
 * The point grid: one row per x value, one column per replicate. A block pasted from a spreadsheet into
 * the first cell, or any block with a header row, replaces the grid; a block pasted elsewhere fills the
 * cells from there, as a spreadsheet would.
 */
export function PointGridEditor({ state, onChange, xTitle, yTitle, problems, parse, onBlockPasted, onToggleExclusion }: PointGridEditorProps) {
  const problemByCell = new Map(problems.map((problem) => [problem.cell, problem.message]));

  const handlePaste = (event: ClipboardEvent<HTMLInputElement>, rowIndex: number, column: number) => {
    const text = event.clipboardData.getData('text/plain');
    const cells = splitPastedText(text);
    if (cells.rows.length <= 1 && (cells.rows[0]?.length ?? 0) <= 1) return;
    event.preventDefault();
    const block = parse(text);
    const hasHeader = block.rows.length < cells.rows.length;
    if (hasHeader || (rowIndex === 0 && column === 0)) {
      onChange(gridFromBlock(block));
      onBlockPasted(block);
      return;
    }
    onChange(fillCells(state, rowIndex, column, cells.rows));
  };

  return (
    <div className="space-y-2">
      <div className="overflow-x-auto rounded-md border border-paper-300">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Entry grid: {xTitle} and {yTitle} by replicate</caption>
          <thead className="bg-paper-100 text-left text-xs text-ink-700">
            <tr>
              <th scope="col" className="w-10 px-2 py-1.5 font-medium">#</th>
              <th scope="col" className="px-2 py-1.5 font-medium">{xTitle}</th>
              {Array.from({ length: state.replicates }, (_, index) => (
                <th key={index} scope="col" className="px-2 py-1.5 font-medium">
                  {yTitle}
                  {state.replicates > 1 && <span className="text-ink-500"> · rep. {index + 1}</span>}
                </th>
              ))}
              <th scope="col" className="w-10 px-1 py-1.5">
                <span className="sr-only">Remove row</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {state.rows.map((row, rowIndex) => (
              <tr key={row.id} className="border-t border-paper-200">
                <th scope="row" className="px-2 text-right text-xs font-normal text-ink-500">
                  {rowIndex + 1}
                </th>
                <td className="p-0.5">
                  <CellInput
                    label={`Row ${rowIndex + 1}, ${xTitle}`}
                    value={row.x}
                    problem={problemByCell.get(`${row.id}:x`)}
                    onChange={(value) => onChange(setCell(state, row.id, 'x', value))}
                    onPaste={(event) => handlePaste(event, rowIndex, 0)}
                  />
                </td>
                {Array.from({ length: state.replicates }, (_, column) => {
                  const key = pointKey(row.id, column + 1);
                  const excluded = state.exclusions[key] !== undefined;
                  const value = row.y[column] ?? '';
                  const cellLabel = `Row ${rowIndex + 1}, replicate ${column + 1}`;
                  return (
                    <td key={column} className="p-0.5">
                      <div className="flex items-center gap-0.5">
                        <CellInput
                          label={`${cellLabel}, ${yTitle}`}
                          value={value}
                          excluded={excluded}
                          problem={problemByCell.get(`${row.id}:${column + 1}`)}
                          onChange={(text) => onChange(setCell(state, row.id, column, text))}
                          onPaste={(event) => handlePaste(event, rowIndex, column + 1)}
                        />
                        {value.trim() !== '' && (
                          <button
                            type="button"
                            onClick={() => onToggleExclusion(key)}
                            aria-label={excluded ? `Include ${cellLabel} again` : `Exclude ${cellLabel}`}
                            title={excluded ? `Excluded: ${state.exclusions[key]}. Include again` : 'Exclude this point'}
                            className={`inline-flex size-6 shrink-0 items-center justify-center rounded text-xs ${excluded ? 'bg-ink-700 text-white' : 'text-ink-500 hover:bg-paper-200'}`}
                          >
                            <span aria-hidden>{excluded ? '↺' : '⊘'}</span>
                          </button>
                        )}
                      </div>
                    </td>
                  );
                })}
                <td className="p-0.5 text-center">
                  <button
                    type="button"
                    onClick={() => onChange(removeRow(state, row.id))}
                    aria-label={`Remove row ${rowIndex + 1}`}
                    className="inline-flex size-6 items-center justify-center rounded text-ink-500 hover:bg-paper-200"
                  >
                    <span aria-hidden>×</span>
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <Button onClick={() => onChange(setReplicateCount(state, state.replicates + 1))} disabled={state.replicates >= maxReplicates}>
          Add a replicate column
        </Button>
        {state.replicates > 1 && <Button onClick={() => onChange(setReplicateCount(state, state.replicates - 1))}>Remove the last replicate column</Button>}
      </div>
      {problems.length > 0 && (
        <ul className="space-y-0.5 text-sm text-signal-danger" aria-label="Cells that cannot be used">
          {problems.map((problem) => (
            <li key={problem.cell} className="flex gap-1">
              <span aria-hidden>⚠</span> {problem.message}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function CellInput({
  label,
  value,
  problem,
  excluded = false,
  onChange,
  onPaste,
}: {
  label: string;
  value: string;
  problem?: string;
  excluded?: boolean;
  onChange: (value: string) => void;
  onPaste: (event: ClipboardEvent<HTMLInputElement>) => void;
}) {
  return (
    <input
      type="text"
      inputMode="decimal"
      aria-label={label}
      aria-invalid={problem ? true : undefined}
      title={problem ?? (excluded ? 'Excluded from the fit' : undefined)}
      value={value}
      onChange={(event) => onChange(event.target.value)}
      onPaste={onPaste}
      className={`numeric w-full min-w-20 rounded border px-2 py-1 font-mono text-sm focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200 ${
        problem ? 'border-signal-danger bg-signal-danger-soft' : excluded ? 'border-paper-300 bg-paper-100 text-ink-400 line-through' : 'border-transparent bg-white hover:border-paper-300'
      }`}
    />
  );
}
