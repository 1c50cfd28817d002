import type { ReactNode } from 'react';

type Tone = 'danger' | 'caution' | 'fine' | 'info';

const tones: Record<Tone, { className: string; icon: string; label: string }> = {
  danger: { className: 'border-signal-danger bg-signal-danger-soft text-signal-danger', icon: '⚠', label: 'Problem' },
  caution: { className: 'border-signal-caution bg-signal-caution-soft text-signal-caution', icon: '!', label: 'Caution' },
  fine: { className: 'border-signal-fine bg-signal-fine-soft text-signal-fine', icon: '✓', label: 'Done' },
  info: { className: 'border-lagoon-300 bg-lagoon-50 text-lagoon-900', icon: 'i', label: 'Note' },
};

/** A message with an icon and a word for its kind, so meaning never rests on colour alone. */
export function Notice({ tone, title, children }: { tone: Tone; title?: string; children?: ReactNode }) {
  const style = tones[tone];
  return (
    <div role={tone === 'danger' ? 'alert' : 'status'} className={`flex gap-3 rounded-md border-l-4 px-4 py-3 text-sm ${style.className}`}>
      <span aria-hidden className="mt-0.5 inline-flex size-5 shrink-0 items-center justify-center rounded-full border border-current text-xs font-bold">
        {style.icon}
      </span>
      <div className="space-y-1">
        <p className="font-semibold">
          <span className="sr-only">{style.label}: </span>
          {title}
        </p>
        {children && <div className="text-ink-700">{children}</div>}
      </div>
    </div>
  );
}
