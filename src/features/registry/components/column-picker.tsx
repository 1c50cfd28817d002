import { useEffect, useRef } from 'react';
import { alwaysVisibleColumn, defaultVisibleColumns, registryColumnIds, type RegistryColumnId } from '../registry-view';
import { columnTitles } from './column-titles';

export interface ColumnPickerProps {
  columns: readonly RegistryColumnId[];
  onChange: (columns: RegistryColumnId[]) => void;
}

/** Shows and hides grid columns; the choice is part of the view (and so of the address). */
export function ColumnPicker({ columns, onChange }: ColumnPickerProps) {
  const details = useRef<HTMLDetailsElement>(null);
  const visible = new Set(columns);

  // A disclosure closes itself only from its summary; a click elsewhere or Escape should close it too.
  useEffect(() => {
    const close = (event: Event) => {
      const element = details.current;
      if (!element?.open) return;
      if (event instanceof KeyboardEvent ? event.key === 'Escape' : !element.contains(event.target as Node)) element.open = false;
    };
    document.addEventListener('mousedown', close);
    document.addEventListener('keydown', close);
    return () => {
      document.removeEventListener('mousedown', close);
      document.removeEventListener('keydown', close);
    };
  }, []);

  const toggle = (id: RegistryColumnId) => {
    const next = new Set(visible);
    if (next.has(id)) next.delete(id);
    else next.add(id);
    onChange(registryColumnIds.filter((column) => next.has(column)));
  };

  return (
    <details ref={details} className="relative">
      <summary className="inline-flex cursor-pointer list-none items-center gap-2 rounded-md border border-paper-300 bg-white px-3 py-1.5 text-sm font-semibold text-ink-900 hover:bg-paper-100">
        Columns
        <span className="text-xs font-normal text-ink-500">
          {columns.length} of {registryColumnIds.length}
        </span>
        <span aria-hidden className="text-xs">▾</span>
      </summary>
      <div className="absolute right-0 z-20 mt-1 w-64 rounded-md border border-paper-300 bg-white p-3 shadow-card">
        <fieldset>
          <legend className="mb-2 text-xs font-semibold text-ink-600">Show these columns</legend>
          <ul className="space-y-1">
            {registryColumnIds.map((id) => (
              <li key={id}>
                <label className="flex items-center gap-2 text-sm text-ink-900">
                  <input
                    type="checkbox"
                    className="size-4 accent-lagoon-700"
                    checked={visible.has(id)}
                    disabled={id === alwaysVisibleColumn}
                    onChange={() => toggle(id)}
                  />
                  {columnTitles[id]}
                  {id === alwaysVisibleColumn && <span className="text-xs text-ink-500">(always shown)</span>}
                </label>
              </li>
            ))}
          </ul>
        </fieldset>
        <button
          type="button"
          className="mt-3 text-sm font-semibold text-lagoon-700 hover:underline"
          onClick={() => onChange([...defaultVisibleColumns])}
        >
          Back to the usual columns
        </button>
      </div>
    </details>
  );
}
