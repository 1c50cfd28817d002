import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format';

export interface MessageListItem {
  id: number;
  subject: string;
  to: string;
  at: string;
  badge?: ReactNode;
  detail?: ReactNode;
}

/** The messages of one page as a list to pick from, with paging. */
export function MessageList({
  label,
  items,
  selectedId,
  onSelect,
  page,
  total,
  pageSize,
  onPage,
}: {
  label: string;
  items: MessageListItem[];
  selectedId: number | null;
  onSelect: (id: number) => void;
  page: number;
  total: number;
  pageSize: number;
  onPage: (page: number) => void;
}) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <div className="space-y-2">
      <ul aria-label={label} className="divide-y divide-paper-200 overflow-hidden rounded-lg border border-paper-200 bg-white shadow-card">
        {items.map((item) => (
          <li key={item.id}>
            <button
              type="button"
              aria-current={item.id === selectedId ? 'true' : undefined}
              onClick={() => onSelect(item.id)}
              className={`block w-full border-l-4 px-3 py-2.5 text-left text-sm hover:bg-paper-50 ${item.id === selectedId ? 'border-lagoon-600 bg-lagoon-50' : 'border-transparent'}`}
            >
              <span className="flex items-start justify-between gap-2">
                <span className="font-medium text-ink-900">{item.subject || '(no subject)'}</span>
                {item.badge}
              </span>
              <span className="mt-0.5 flex justify-between gap-2 text-xs text-ink-500">
                <span className="truncate font-mono">{item.to}</span>
                <span className="shrink-0">{formatDateTime(item.at)}</span>
              </span>
              {item.detail && <span className="mt-1 block text-xs text-signal-danger">{item.detail}</span>}
            </button>
          </li>
        ))}
      </ul>
      {pages > 1 && (
        <div className="flex items-center justify-between text-sm text-ink-600">
          <Button variant="quiet" disabled={page <= 1} onClick={() => onPage(page - 1)}>
            ← Newer
          </Button>
          <span>
            Page {page} of {pages}
          </span>
          <Button variant="quiet" disabled={page >= pages} onClick={() => onPage(page + 1)}>
            Older →
          </Button>
        </div>
      )}
    </div>
  );
}
