import { useSearchParams } from 'react-router-dom';
import type { OutboxStatus } from '@shared/schemas/mail';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Tabs } from '@/components/ui/tabs';
import { useOutboxStatus } from '@/features/outbox/api/get-outbox-status';
import { useReceivedMessages } from '@/features/outbox/api/get-received-messages';
import { useSentMessages } from '@/features/outbox/api/get-sent-messages';
import { MessageList } from '@/features/outbox/components/message-list';
import { DeliveryStatusBadge } from '@/components/ui/delivery-status-badge';
import { ReceivedMessagePanel } from '@/features/outbox/components/received-message-panel';
import { SentMessagePanel } from '@/features/outbox/components/sent-message-panel';

type Tab = 'received' | 'sent';

const statusFilters: { value: OutboxStatus | ''; label: string }[] = [
  { value: '', label: 'All' },
  { value: 'failed', label: 'Failed' },
  { value: 'queued', label: 'Queued' },
  { value: 'sent', label: 'Sent' },
];

export default function OutboxRoute() {
  const status = useOutboxStatus();
  const [search, setSearch] = useSearchParams();
  const fake = status.data?.mode === 'fake';
  const tab: Tab = search.get('tab') === 'sent' || (status.data && !fake) ? 'sent' : 'received';
  const page = Math.max(1, Number(search.get('page')) || 1);
  const selected = Number(search.get('message')) || null;
  const statusFilter = (statusFilters.find((filter) => filter.value === search.get('status'))?.value || undefined) as OutboxStatus | undefined;

  const change = (changes: Record<string, string | null>) => {
    const next = new URLSearchParams(search);
    for (const [key, value] of Object.entries(changes)) {
      if (value === null) next.delete(key);
      else next.set(key, value);
    }
    setSearch(next, { replace: true });
  };

  const description = !status.data
    ? undefined
    : status.data.mode === 'fake'
      ? `No SMTP server is configured, so every message goes to the app's own local mail server (${status.data.fakeServer?.host}:${status.data.fakeServer?.port}) and stops here; nothing leaves this machine. Set KCATALOG_SMTP_URL to deliver for real.`
      : status.data.mode === 'smtp'
        ? 'Messages are delivered through the configured SMTP server; this is the send log, with every attempt and error.'
        : 'No mail delivery runs in this process; messages wait in the queue.';

  return (
    <div>
      <PageHeader title="Outbox" description={description} />
      {status.isPending && <LoadingState label="Loading the outbox…" />}
      {status.isError && <ErrorState error={status.error} onRetry={() => void status.refetch()} />}
      {status.data && (
        <div className="space-y-4">
          <Tabs
            label="Outbox lists"
            tabs={[
              ...(fake ? [{ id: 'received' as const, label: `Received (${status.data.received})` }] : []),
              { id: 'sent' as const, label: `Send log${status.data.counts.failed > 0 ? ` (${status.data.counts.failed} failed)` : ''}` },
            ]}
            selected={tab}
            onSelect={(id) => change({ tab: id, page: null, message: null, status: null })}
          />
          {tab === 'received' ? (
            <ReceivedTab page={page} selected={selected} onPage={(next) => change({ page: String(next) })} onSelect={(id) => change({ message: String(id) })} />
          ) : (
            <SentTab
              page={page}
              selected={selected}
              status={statusFilter}
              onStatus={(value) => change({ status: value || null, page: null, message: null })}
              onPage={(next) => change({ page: String(next) })}
              onSelect={(id) => change({ message: String(id) })}
            />
          )}
        </div>
      )}
    </div>
  );
}

function ReceivedTab({ page, selected, onPage, onSelect }: { page: number; selected: number | null; onPage: (page: number) => void; onSelect: (id: number) => void }) {
  const messages = useReceivedMessages(page);
  if (messages.isPending) return <LoadingState label="Loading messages…" />;
  if (messages.isError) return <ErrorState error={messages.error} onRetry={() => void messages.refetch()} />;
  if (messages.data.total === 0) {
    return (
      <EmptyState title="No messages yet.">
        Invitations, password resets and digests appear here as soon as they are sent.
      </EmptyState>
    );
  }
  const current = selected ?? messages.data.rows[0]?.id ?? null;
  return (
    <div className="grid gap-4 lg:grid-cols-[22rem_1fr]">
      <MessageList
        label="Received messages"
        items={messages.data.rows.map((row) => ({ id: row.id, subject: row.subject, to: row.to.join(', '), at: row.receivedAt }))}
        selectedId={current}
        onSelect={onSelect}
        page={page}
        total={messages.data.total}
        pageSize={messages.data.pageSize}
        onPage={onPage}
      />
      {current !== null && <ReceivedMessagePanel id={current} />}
    </div>
  );
}

function SentTab({
  page,
  selected,
  status,
  onStatus,
  onPage,
  onSelect,
}: {
  page: number;
  selected: number | null;
  status: OutboxStatus | undefined;
  onStatus: (status: string) => void;
  onPage: (page: number) => void;
  onSelect: (id: number) => void;
}) {
  const messages = useSentMessages({ page, status });
  return (
    <div className="space-y-3">
      <div role="group" aria-label="Show messages" className="flex gap-1">
        {statusFilters.map((filter) => (
          <button
            key={filter.label}
            type="button"
            aria-pressed={(status ?? '') === filter.value}
            onClick={() => onStatus(filter.value)}
            className={`rounded-md border px-2.5 py-1 text-sm ${(status ?? '') === filter.value ? 'border-lagoon-600 bg-lagoon-50 text-lagoon-900' : 'border-paper-300 bg-white text-ink-700 hover:bg-paper-100'}`}
          >
            {filter.label}
          </button>
        ))}
      </div>
      {messages.isPending && <LoadingState label="Loading the send log…" />}
      {messages.isError && <ErrorState error={messages.error} onRetry={() => void messages.refetch()} />}
      {messages.data && messages.data.total === 0 && <EmptyState title={status ? `No ${status} messages.` : 'Nothing was sent yet.'} />}
      {messages.data && messages.data.total > 0 && (
        <div className="grid gap-4 lg:grid-cols-[22rem_1fr]">
          <MessageList
            label="Send log"
            items={messages.data.rows.map((row) => ({
              id: row.id,
              subject: row.subject,
              to: row.to,
              at: row.sentAt ?? row.createdAt,
              badge: <DeliveryStatusBadge status={row.status} />,
              detail: row.lastError ? `⚠ ${row.lastError}` : undefined,
            }))}
            selectedId={selected ?? messages.data.rows[0]?.id ?? null}
            onSelect={onSelect}
            page={page}
            total={messages.data.total}
            pageSize={messages.data.pageSize}
            onPage={onPage}
          />
          <SentMessagePanel id={selected ?? messages.data.rows[0].id} />
        </div>
      )}
    </div>
  );
}
