/** Rows handled of the rows to handle, as a bar a screen reader reads as a progress bar. */
export function ImportProgress({ processed, total, label }: { processed: number; total: number; label: string }) {
  const share = total === 0 ? 0 : Math.min(1, processed / total);
  return (
    <div className="space-y-1">
      <div className="flex justify-between text-sm">
        <span className="font-medium text-ink-700">{label}</span>
        <span className="numeric font-mono text-ink-600">
          {processed.toLocaleString()} of {total.toLocaleString()} rows ({Math.round(share * 100)} %)
        </span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={processed}
        className="h-3 overflow-hidden rounded-full border border-paper-300 bg-paper-100"
      >
        <div className="h-full rounded-full bg-lagoon-600 transition-[width] duration-300" style={{ width: `${share * 100}%` }} />
      </div>
    </div>
  );
}
