import type { MeasurementDto } from '@shared/schemas/measurement';
import { EmptyState } from '@/components/ui/states';

/**
 * Reporting completeness against the STRENDA Guidelines' required items (Levels 1A and 1B), per current
 * measurement, with what each one lacks.
 */
export function CompletenessPanel({ measurements }: { measurements: readonly MeasurementDto[] }) {
  const current = measurements.filter((measurement) => measurement.supersededById === null && measurement.reviewState !== 'retracted');
  if (current.length === 0) {
    return <EmptyState title="No measurements to score yet." />;
  }
  const best = Math.max(...current.map((measurement) => measurement.completeness.score));
  const complete = current.filter((measurement) => measurement.completeness.missing.length === 0).length;
  return (
    <div className="space-y-3 text-sm">
      <p>
        Best: <span className="font-mono font-semibold tabular-nums">{Math.round(best * 100)} %</span> ·{' '}
        {complete === current.length ? (
          <span className="text-signal-fine">
            <span aria-hidden>✓ </span>every measurement reports every required item
          </span>
        ) : (
          <span>
            {complete} of {current.length} measurements complete
          </span>
        )}
      </p>
      <ul className="space-y-2">
        {current.map((measurement) => (
          <li key={measurement.id} className="flex gap-3">
            <span className="w-14 shrink-0 font-mono text-ink-700">#{measurement.id}</span>
            <span className="w-24 shrink-0">
              <Meter score={measurement.completeness.score} />
            </span>
            <span className="text-ink-700">
              {measurement.completeness.missing.length === 0 ? (
                <span className="text-ink-500">complete</span>
              ) : (
                <>
                  <span className="sr-only">Missing: </span>
                  <span aria-hidden className="text-signal-caution">
                    !{' '}
                  </span>
                  missing {measurement.completeness.missing.join('; ')}
                </>
              )}
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}

function Meter({ score }: { score: number }) {
  const percent = Math.round(score * 100);
  return (
    <span className="flex items-center gap-1.5" title={`${percent} % of the required items`}>
      <span className="h-1.5 w-12 overflow-hidden rounded-full bg-paper-200" aria-hidden>
        <span className="block h-full bg-lagoon-600" style={{ width: `${percent}%` }} />
      </span>
      <span className="font-mono text-xs tabular-nums">{percent} %</span>
    </span>
  );
}
