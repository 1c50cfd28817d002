import { cofactorLabels, cofactors, type Cofactor } from '@shared/schemas/enzyme';

interface CofactorsFieldProps {
  value: readonly Cofactor[];
  onChange: (value: Cofactor[]) => void;
  error?: string;
}

/** The listed cofactors as checkboxes (typeset labels, plain values). */
export function CofactorsField({ value, onChange, error }: CofactorsFieldProps) {
  const toggle = (cofactor: Cofactor, checked: boolean) =>
    onChange(checked ? cofactors.filter((candidate) => candidate === cofactor || value.includes(candidate)) : value.filter((candidate) => candidate !== cofactor));
  return (
    <fieldset className="space-y-1" aria-describedby={error ? 'cofactors-error' : undefined}>
      <legend className="text-sm font-medium text-ink-700">Cofactors</legend>
      <div className="flex flex-wrap gap-x-4 gap-y-2 pt-1">
        {cofactors.map((cofactor) => (
          <label key={cofactor} className="inline-flex items-center gap-1.5 text-sm text-ink-900">
            <input
              type="checkbox"
              className="size-4 accent-lagoon-700"
              checked={value.includes(cofactor)}
              onChange={(event) => toggle(cofactor, event.target.checked)}
            />
            {cofactorLabels[cofactor]}
          </label>
        ))}
      </div>
      {error && (
        <p id="cofactors-error" className="flex items-center gap-1 text-sm text-signal-danger">
          <span aria-hidden>⚠</span> {error}
        </p>
      )}
    </fieldset>
  );
}
