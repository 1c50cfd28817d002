import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { CampaignCyclesDto, CycleDto, CycleEnergiesDto } from '@shared/schemas/comparison';
import { EmptyState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { formatEnergyFigures, formatPh } from '@/lib/format';
import { KcatOverKmSymbol, KcatSymbol } from './rate-symbols';

// A coupling energy within two standard errors of zero is read as additive (about 95 % for a normal
// error; common practice in double-mutant cycle analysis).
const ADDITIVE_WITHIN_SE = 2;

interface CyclesPanelProps {
  variantId: number;
  cycles: CampaignCyclesDto;
  unit: EnergyUnit;
}

/** The double-mutant cycles this variant is a corner of, with the coupling energy ΔΔG_int ± SE. */
export function CyclesPanel({ variantId, cycles, unit }: CyclesPanelProps) {
  const touches = (cycle: { combination: { id: number }; a: { id: number }; b: { id: number } }) =>
    cycle.combination.id === variantId || cycle.a.id === variantId || cycle.b.id === variantId;
  const mine = cycles.cycles.filter(touches);
  const unmatched = cycles.unmatched.filter(touches);

  if (mine.length === 0 && unmatched.length === 0) {
    return (
      <EmptyState title="Not part of a measured double-mutant cycle.">
        A cycle needs a combination and variants carrying each part of it, all measured with the parent under matched conditions.
      </EmptyState>
    );
  }
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-600">
        ΔΔG<sub>int</sub> = ΔΔG‡(AB) − ΔΔG‡(A) − ΔΔG‡(B), from kcat/Km (kcat below). Within {ADDITIVE_WITHIN_SE} SE of zero the changes act
        independently.
      </p>
      {mine.map((cycle) => (
        <CycleCard key={`${cycle.combination.id}-${cycle.a.id}-${cycle.b.id}-${cycle.temperatureC}-${cycle.ph}`} cycle={cycle} variantId={variantId} unit={unit} />
      ))}
      {unmatched.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-ink-900">Cycles without matched measurements</h3>
          <ul className="mt-1 space-y-1 text-sm text-ink-700">
            {unmatched.map((cycle) => (
              <li key={`${cycle.combination.id}-${cycle.a.id}-${cycle.b.id}`}>
                <span className="font-mono">
                  {cycle.combination.label} = {cycle.a.label} + {cycle.b.label}
                </span>
                : {cycle.reason}.
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

function CycleCard({ cycle, variantId, unit }: { cycle: CycleDto; variantId: number; unit: EnergyUnit }) {
  return (
    <article className="rounded-lg border border-paper-200 bg-white p-4" aria-label={`Cycle ${cycle.combination.label}`}>
      <h3 className="flex flex-wrap items-baseline gap-x-2 font-mono text-sm font-semibold">
        <Corner corner={cycle.combination} variantId={variantId} /> <span className="font-sans font-normal text-ink-500">from</span>{' '}
        <Corner corner={cycle.a} variantId={variantId} /> <span className="font-sans font-normal text-ink-500">and</span>{' '}
        <Corner corner={cycle.b} variantId={variantId} />
      </h3>
      <p className="text-xs text-ink-500">
        {cycle.substrate} · {Number(cycle.temperatureC.toFixed(1))} °C · pH {formatPh(cycle.ph)}
      </p>
      <table className="mt-2 w-full text-sm">
        <caption className="sr-only">Free energies of the cycle</caption>
        <thead className="text-xs uppercase tracking-wide text-ink-600">
          <tr className="border-b border-paper-200">
            <th scope="col" className="py-1 pr-2 text-left font-semibold normal-case">in {unit}</th>
            <th scope="col" className="py-1 pr-2 text-right font-semibold normal-case">ΔΔG‡(A) + ΔΔG‡(B)</th>
            <th scope="col" className="py-1 pr-2 text-right font-semibold normal-case">ΔΔG‡(AB)</th>
            <th scope="col" className="py-1 text-right font-semibold normal-case">
              ΔΔG<sub>int</sub>
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-100">
          <EnergyRow name={<KcatOverKmSymbol />} energies={cycle.kcatOverKm} unit={unit} />
          <EnergyRow name={<KcatSymbol />} energies={cycle.kcat} unit={unit} />
        </tbody>
      </table>
    </article>
  );
}

function Corner({ corner, variantId }: { corner: { id: number; label: string }; variantId: number }) {
  if (corner.id === variantId) return <span className="rounded bg-ember-50 px-1 text-ember-700">{corner.label}</span>;
  return (
    <Link to={paths.variant.href(corner.id)} className="text-lagoon-700 underline-offset-2 hover:underline">
      {corner.label}
    </Link>
  );
}

function EnergyRow({ name, energies, unit }: { name: ReactNode; energies: CycleEnergiesDto | null; unit: EnergyUnit }) {
  if (!energies) {
    return (
      <tr>
        <th scope="row" className="py-1 pr-2 text-left font-normal">
          {name}
        </th>
        <td colSpan={3} className="py-1 text-right text-ink-500">
          not measured at every corner
        </td>
      </tr>
    );
  }
  const coupling = energies.coupling.kJPerMol;
  const additive = Math.abs(coupling.value) <= ADDITIVE_WITHIN_SE * coupling.se;
  const reading = additive ? 'additive within error' : coupling.value > 0 ? 'AB slower than additive' : 'AB faster than additive';
  return (
    <tr>
      <th scope="row" className="py-1 pr-2 text-left font-normal">
        {name}
      </th>
      <td className="numeric whitespace-nowrap py-1 pr-2 font-mono">{formatEnergyFigures(energies.predictedAdditive.value, energies.predictedAdditive.se, unit)}</td>
      <td className="numeric whitespace-nowrap py-1 pr-2 font-mono">{formatEnergyFigures(energies.ddgAB.value, energies.ddgAB.se, unit)}</td>
      <td className="numeric py-1 font-mono">
        <span className="whitespace-nowrap font-semibold">{formatEnergyFigures(coupling.value, coupling.se, unit)}</span>
        <span className="block font-sans text-xs text-ink-600">{reading}</span>
      </td>
    </tr>
  );
}
