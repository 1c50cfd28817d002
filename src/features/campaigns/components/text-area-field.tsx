import { forwardRef, useId, type ReactNode, type TextareaHTMLAttributes } from 'react';

export interface TextAreaFieldProps extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string;
  error?: string;
  hint?: ReactNode;
}

/** A labelled multi-line field in the look of the shared TextField, with its error or hint below. */
export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaFieldProps>(function TextAreaField(
  { label, error, hint, className = '', ...props },
  ref,
) {
  const generatedId = useId();
  const id = props.id ?? generatedId;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-ink-700">
        {label}
      </label>
      <textarea
        ref={ref}
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`block w-full rounded-md border bg-white px-3 py-2 text-sm text-ink-900 placeholder:text-ink-400 focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200 ${error ? 'border-signal-danger' : 'border-paper-300'} ${className}`}
        {...props}
      />
      {error ? (
        <p id={`${id}-error`} className="flex items-center gap-1 text-sm text-signal-danger">
          <span aria-hidden>⚠</span> {error}
        </p>
      ) : (
        hint && (
          <p id={`${id}-hint`} className="text-sm text-ink-500">
            {hint}
          </p>
        )
      )}
    </div>
  );
});
