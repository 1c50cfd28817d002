import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';

const variants: Record<Variant, string> = {
  primary: 'bg-ember-500 text-white hover:bg-ember-600 disabled:bg-ember-100 disabled:text-ember-700',
  secondary: 'border border-paper-300 bg-white text-ink-900 hover:bg-paper-100 disabled:text-ink-400',
  quiet: 'text-lagoon-700 hover:bg-lagoon-50 disabled:text-ink-400',
  danger: 'border border-signal-danger bg-white text-signal-danger hover:bg-signal-danger-soft',
};

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  busy?: boolean;
}

export function Button({ variant = 'secondary', busy = false, className = '', children, disabled, type = 'button', ...props }: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed ${variants[variant]} ${className}`}
      {...props}
    >
      {busy && <Spinner />}
      {children}
    </button>
  );
}

export function Spinner({ label }: { label?: string }) {
  return (
    <span role={label ? 'status' : undefined} className="inline-flex items-center gap-2">
      <span aria-hidden className="size-4 animate-spin rounded-full border-2 border-current border-r-transparent" />
      {label && <span>{label}</span>}
    </span>
  );
}
