import { energyUnits } from '@shared/schemas/auth';
import { useEnergyUnit } from '../api/update-preferences';

/** Switches ΔΔG‡ between kJ/mol and kcal/mol everywhere; the choice is remembered for the user. */
export function EnergyUnitToggle() {
  const [unit, setUnit] = useEnergyUnit();
  return (
    <div role="group" aria-label="Energy unit" className="inline-flex overflow-hidden rounded-md border border-paper-300 bg-white text-xs">
      {energyUnits.map((option) => (
        <button
          key={option}
          type="button"
          aria-pressed={unit === option}
          onClick={() => setUnit(option)}
          className={`px-2.5 py-1 font-medium ${unit === option ? 'bg-lagoon-700 text-white' : 'text-ink-700 hover:bg-paper-100'}`}
        >
          {option}
        </button>
      ))}
    </div>
  );
}
