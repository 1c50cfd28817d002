import { Link } from 'react-router-dom';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { CampaignCyclesDto } from '@shared/schemas/comparison';
import { paths } from '@/config/paths';
import { formatEnergyFigures } from '@/lib/format';

/** Rows listed; the plot shows every cycle, the table the strongest couplings. */
const MAX_ROWS = 25;

/** The double-mutant cycles behind the additivity plot, largest coupling first, and the combinations without one. */
export function CouplingTable({ cycles, unit }: { cycles: CampaignCyclesDto; unit: EnergyUnit }) {
  const complete = cycles.cycles
    .filter((cycle) => cycle.kcatOverKm !== null)
    .sort((first, second) => Math.abs(second.kcatOverKm!.coupling.kJPerMol.value) - Math.abs(first.kcatOverKm!.coupling.kJPerMol.value));
  const rows = complete.slice(0, MAX_ROWS);
  return (
    <div className="space-y-2">
      <table className="w-full text-sm" aria-label="Coupling energies of double-mutant cycles">
        <thead className="text-left text-xs text-ink-500">
          <tr className="border-b border-paper-200">
            <th scope="col" className="py-1 pr-2 font-medium">Combination</th>
            <th scope="col" className="py-1 pr-2 font-medium">Singles</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">ΔΔG‡ observed ({unit})</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Sum of singles ({unit})</th>
            <th scope="col" className="py-1 text-right font-medium">Coupling ΔΔG‡int ({unit})</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((cycle) => {
            const energies = cycle.kcatOverKm!;
            return (
              <tr key={`${cycle.combination.id}-${cycle.a.id}-${cycle.b.id}`} className="border-b border-paper-100">
                <th scope="row" className="py-1 pr-2 text-left font-mono font-medium">
                  <Link to={paths.variant.href(cycle.combination.id)} className="text-lagoon-700 underline-offset-2 hover:underline">
                    {cycle.combination.label}
                  </Link>
                </th>
                <td className="whitespace-nowrap py-1 pr-2 font-mono text-xs">
                  {cycle.a.label} + {cycle.b.label}
                </td>
                <td className="numeric whitespace-nowrap py-1 pr-2 font-mono">{formatEnergyFigures(energies.ddgAB.value, energies.ddgAB.se, unit)}</td>
                <td className="numeric whitespace-nowrap py-1 pr-2 font-mono">{formatEnergyFigures(energies.predictedAdditive.value, energies.predictedAdditive.se, unit)}</td>
                <td className="numeric whitespace-nowrap py-1 font-mono">{formatEnergyFigures(energies.coupling.kJPerMol.value, energies.coupling.kJPerMol.se, unit)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {complete.length > rows.length && (
        <p className="text-sm text-ink-500">
          The {rows.length} strongest couplings of {complete.length.toLocaleString('en-US')} cycles; the plot shows them all.
        </p>
      )}
      {cycles.unmatched.length > 0 && (
        <details className="text-sm text-ink-700">
          <summary className="cursor-pointer font-medium">{cycles.unmatched.length} combinations without a complete cycle</summary>
          <ul className="mt-1 list-disc space-y-0.5 pl-5">
            {cycles.unmatched.slice(0, MAX_ROWS).map((item) => (
              <li key={`${item.combination.id}-${item.a.id}-${item.b.id}`}>
                <span className="font-mono">{item.combination.label}</span>: {item.reason}
              </li>
            ))}
          </ul>
          {cycles.unmatched.length > MAX_ROWS && <p className="mt-1 text-ink-500">…and {(cycles.unmatched.length - MAX_ROWS).toLocaleString('en-US')} more.</p>}
        </details>
      )}
    </div>
  );
}
