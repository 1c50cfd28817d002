import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';

export const controlClass =
  'block w-full rounded-md border bg-white px-3 py-2 text-sm text-ink-900 placeholder:text-ink-400 focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200';

interface FieldFrameProps {
  id: string;
  label: string;
  error?: string;
  hint?: ReactNode;
  children: ReactNode;
}

/**
 * What every field's control carries: its id, its invalid state and the id of the text below it, and the
 * shared look with a red border on error.
 */
export function controlAttributes(id: string, error: string | undefined, hint: ReactNode, className: string) {
  return {
    id,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': error ? `${id}-error` : hint ? `${id}-hint` : undefined,
    className: `${controlClass} ${error ? 'border-signal-danger' : 'border-paper-300'} ${className}`,
  };
}

/** The label above a control and its error (or else its hint) below, tied to it by id. */
export function FieldFrame({ id, label, error, hint, children }: FieldFrameProps) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-ink-700">
        {label}
      </label>
      {children}
      {error ? (
        <p id={`${id}-error`} className="flex items-center gap-1 text-sm text-signal-danger">
          <span aria-hidden>⚠</span> {error}
        </p>
      ) : (
        hint && <p id={`${id}-hint`} className="text-sm text-ink-500">{hint}</p>
      )}
    </div>
  );
}

export interface TextFieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string;
  hint?: ReactNode;
}

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField({ label, error, hint, className = '', ...props }, ref) {
  const generatedId = useId();
  const id = props.id ?? generatedId;
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint}>
      <input ref={ref} {...controlAttributes(id, error, hint, className)} {...props} />
    </FieldFrame>
  );
});

export interface SelectFieldProps extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  error?: string;
  hint?: ReactNode;
  options: readonly { value: string; label: string }[];
}

export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField({ label, error, hint, options, className = '', ...props }, ref) {
  const generatedId = useId();
  const id = props.id ?? generatedId;
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint}>
      <select ref={ref} {...controlAttributes(id, error, hint, className)} {...props}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
});
