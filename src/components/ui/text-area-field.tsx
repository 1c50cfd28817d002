import { forwardRef, useId, type ReactNode, type TextareaHTMLAttributes } from 'react';
import { controlClass, FieldFrame } from './field';

export interface TextAreaFieldProps extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string;
  error?: string;
  hint?: ReactNode;
}

/** A labelled multi-line field in the look of the shared TextField, with its error or hint below. */
export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaFieldProps>(function TextAreaField({ label, error, hint, className = '', ...props }, ref) {
  const generatedId = useId();
  const id = props.id ?? generatedId;
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint}>
      <textarea
        ref={ref}
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`${controlClass} ${error ? 'border-signal-danger' : 'border-paper-300'} ${className}`}
        {...props}
      />
    </FieldFrame>
  );
});
