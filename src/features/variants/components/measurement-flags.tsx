import type { MeasurementDto } from '@shared/schemas/measurement';

/** Plausibility flags and fit warnings as an icon and words; severity is in the text, not only the colour. */
export function MeasurementFlags({ measurement }: { measurement: Pick<MeasurementDto, 'flags' | 'warnings'> }) {
  if (measurement.flags.length === 0 && measurement.warnings.length === 0) return <span className="text-ink-500">none</span>;
  return (
    <ul className="space-y-1">
      {measurement.flags.map((flag) => (
        <li key={flag.code} className={`flex gap-1.5 ${flag.severity === 'implausible' ? 'text-signal-danger' : 'text-signal-caution'}`}>
          <span aria-hidden className="font-bold">
            {flag.severity === 'implausible' ? '⚠' : '!'}
          </span>
          <span>
            <span className="font-semibold">{flag.severity === 'implausible' ? 'Implausible' : 'Warning'}:</span> {flag.message}
          </span>
        </li>
      ))}
      {measurement.warnings.map((warning) => (
        <li key={warning} className="flex gap-1.5 text-signal-caution">
          <span aria-hidden className="font-bold">
            !
          </span>
          <span>
            <span className="font-semibold">Fit:</span> {warning}
          </span>
        </li>
      ))}
    </ul>
  );
}
