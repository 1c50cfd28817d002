import type { ReactNode } from 'react';

export interface TabItem<T extends string> {
  id: T;
  label: ReactNode;
}

/** A row of tab buttons (WAI-ARIA tabs pattern); the caller renders the selected panel. */
export function Tabs<T extends string>({ label, tabs, selected, onSelect }: { label: string; tabs: readonly TabItem<T>[]; selected: T; onSelect: (id: T) => void }) {
  return (
    <div role="tablist" aria-label={label} className="flex gap-1 border-b border-paper-200">
      {tabs.map((tab) => (
        <button
          key={tab.id}
          type="button"
          role="tab"
          aria-selected={tab.id === selected}
          onClick={() => onSelect(tab.id)}
          className={`-mb-px border-b-2 px-3 py-2 text-sm font-medium ${tab.id === selected ? 'border-ember-500 text-ink-900' : 'border-transparent text-ink-500 hover:text-ink-900'}`}
        >
          {tab.label}
        </button>
      ))}
    </div>
  );
}
