import { useMemo } from 'react';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { CycleDto } from '@shared/schemas/comparison';
import { energyIn } from '@/lib/format';
import { additivitySpec } from '../specs/additivity-spec';
import { counted } from '../specs/spec-parts';
import { VegaChart } from './vega-chart';

export interface AdditivityChartProps {
  cycles: readonly CycleDto[];
  unit: EnergyUnit;
  campaignName: string;
  onOpenVariant: (variantId: number) => void;
}

/** Observed ΔΔG‡ (kcat/Km) of each combination against the sum of its singles, with the y = x line. */
export function AdditivityChart({ cycles, unit, campaignName, onOpenVariant }: AdditivityChartProps) {
  const points = useMemo(
    () =>
      cycles
        .filter((cycle) => cycle.kcatOverKm !== null)
        .map((cycle) => {
          const energies = cycle.kcatOverKm!;
          const convert = (kJ: number) => energyIn(kJ, unit);
          const coupling = unit === 'kJ/mol' ? energies.coupling.kJPerMol : energies.coupling.kcalPerMol;
          return {
            combinationId: cycle.combination.id,
            label: cycle.combination.label,
            predicted: convert(energies.predictedAdditive.value),
            predictedSe: convert(energies.predictedAdditive.se),
            observed: convert(energies.ddgAB.value),
            observedSe: convert(energies.ddgAB.se),
            coupling: coupling.value,
            couplingSe: coupling.se,
          };
        }),
    [cycles, unit],
  );
  const spec = useMemo(
    () =>
      additivitySpec({
        title: 'Additivity of combinations',
        subtitle: `${campaignName}: ΔΔG‡ from kcat/Km, ${counted(points.length, 'double-mutant cycle')}.`,
        unit,
        points,
      }),
    [points, unit, campaignName],
  );
  return (
    <VegaChart
      spec={spec}
      title="Additivity plot"
      description={`Observed against predicted ΔΔG‡ in ${unit} for ${counted(points.length, 'combination')}, with the y = x line of additivity.`}
      fileName={`${campaignName}-additivity`}
      heightClass="min-h-96"
      onDatumClick={(datum) => {
        if (typeof datum.combinationId === 'number') onOpenVariant(datum.combinationId);
      }}
    />
  );
}
