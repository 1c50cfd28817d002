import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';

/** Reasons kineticists give most often; "other" asks for words. */
const REASONS = [
  'Outlier: pipetting or mixing error suspected',
  'Not an initial rate (lag phase or substrate depletion)',
  'Reading outside the detector’s linear range',
  'Substrate precipitated or did not dissolve',
  'Bubble or scratch in the well',
] as const;
const OTHER = 'other';

export interface ExcludePointDialogProps {
  /** What is being excluded, e.g. `Row 4, replicate 2: [S] 0.5 mM, v₀ 210 µM/min`; null closes the dialog. */
  pointDescription: string | null;
  onExclude: (reason: string) => void;
  onClose: () => void;
}

/** Asks why a point is left out of the fit; the reason is stored with the point. */
export function ExcludePointDialog({ pointDescription, onExclude, onClose }: ExcludePointDialogProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [choice, setChoice] = useState<string>(REASONS[0]);
  const [other, setOther] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const titleId = useId();
  const otherId = useId();

  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (pointDescription !== null && !element.open) element.showModal();
    if (pointDescription === null && element.open) element.close();
  }, [pointDescription]);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const reason = choice === OTHER ? other.trim() : choice;
    if (reason === '') {
      setProblem('Say why the point is excluded.');
      return;
    }
    if (reason.length > 300) {
      setProblem('Keep the reason under 300 characters.');
      return;
    }
    setProblem(null);
    setOther('');
    onExclude(reason);
  };

  return (
    <dialog
      ref={dialog}
      aria-labelledby={titleId}
      onClose={onClose}
      className="m-auto w-full max-w-lg rounded-lg border border-paper-300 bg-white p-0 text-ink-900 shadow-card backdrop:bg-ink-900/40"
    >
      <form onSubmit={handleSubmit} className="space-y-4 p-5">
        <div>
          <h2 id={titleId} className="text-lg font-semibold">
            Exclude this point from the fit
          </h2>
          <p className="mt-1 font-mono text-sm text-ink-700">{pointDescription}</p>
          <p className="mt-1 text-sm text-ink-500">The point stays stored with the assay and its reason; it no longer enters the fit.</p>
        </div>
        <fieldset className="space-y-1.5">
          <legend className="text-sm font-medium text-ink-700">Reason</legend>
          {[...REASONS, OTHER].map((reason) => (
            <label key={reason} className="flex items-start gap-2 text-sm">
              <input type="radio" name="reason" value={reason} checked={choice === reason} onChange={() => setChoice(reason)} className="mt-1 accent-lagoon-700" />
              <span>{reason === OTHER ? 'Another reason' : reason}</span>
            </label>
          ))}
        </fieldset>
        {choice === OTHER && (
          <div className="space-y-1">
            <label htmlFor={otherId} className="block text-sm font-medium text-ink-700">
              Other reason
            </label>
            <input
              id={otherId}
              value={other}
              onChange={(event) => setOther(event.target.value)}
              maxLength={300}
              className="block w-full rounded-md border border-paper-300 px-3 py-2 text-sm focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200"
            />
          </div>
        )}
        {problem && (
          <p role="alert" className="text-sm text-signal-danger">
            <span aria-hidden>⚠ </span>
            {problem}
          </p>
        )}
        <div className="flex justify-end gap-2">
          <Button onClick={() => dialog.current?.close()}>Cancel</Button>
          <Button type="submit" variant="primary">
            Exclude and refit
          </Button>
        </div>
      </form>
    </dialog>
  );
}
