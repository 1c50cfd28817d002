/** One fitted parameter as the table shows it: the figures already written out. */
export interface ParameterRow {
  name: string;
  /** The value in the units the page stores (for the browser tests' data attribute). */
  storedValue: number;
  value: string;
  se: string;
  ci95: string;
  unit: string;
}

/** The fitted parameters of a live fit: value, standard error, 95 % confidence interval and unit. */
export function ParameterTable({ label, rows }: { label: string; rows: readonly ParameterRow[] }) {
  return (
    <table className="w-full text-sm" aria-label={label}>
      <thead className="text-left text-xs text-ink-500">
        <tr className="border-b border-paper-200">
          <th scope="col" className="py-1 pr-2 font-medium">Parameter</th>
          <th scope="col" className="py-1 pr-2 text-right font-medium">Value</th>
          <th scope="col" className="py-1 pr-2 text-right font-medium">± SE</th>
          <th scope="col" className="py-1 pr-2 text-right font-medium">95 % CI</th>
          <th scope="col" className="py-1 font-medium">Unit</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.name} className="border-b border-paper-100">
            <th scope="row" className="py-1 pr-2 text-left font-medium">{row.name}</th>
            <td className="numeric py-1 pr-2 font-mono" data-parameter={row.name} data-value={row.storedValue}>
              {row.value}
            </td>
            <td className="numeric py-1 pr-2 font-mono">{row.se}</td>
            <td className="numeric py-1 pr-2 font-mono whitespace-nowrap">{row.ci95}</td>
            <td className="py-1 text-ink-700">{row.unit}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
