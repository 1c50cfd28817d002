import { forwardRef, useId, type ReactNode, type TextareaHTMLAttributes } from 'react';
import { controlAttributes, FieldFrame } from './field';

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
      <textarea ref={ref} {...controlAttributes(id, error, hint, className)} {...props} />
    </FieldFrame>
  );
});
