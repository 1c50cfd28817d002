import type { ReactNode } from 'react';
import { Button, Spinner } from './button';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex min-h-32 items-center justify-center text-ink-500">
      <Spinner label={label} />
    </div>
  );
}

export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <div role="alert" className="flex flex-col items-start gap-3 rounded-lg border border-signal-danger bg-signal-danger-soft p-5 text-sm">
      <p className="font-semibold text-signal-danger">
        <span aria-hidden>⚠ </span>This could not be loaded.
      </p>
      <p className="text-ink-700">{message}</p>
      {onRetry && <Button onClick={onRetry}>Try again</Button>}
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-paper-300 bg-white px-6 py-10 text-center">
      <p className="font-semibold text-ink-700">{title}</p>
      {children && <div className="mt-2 text-sm text-ink-500">{children}</div>}
    </div>
  );
}
