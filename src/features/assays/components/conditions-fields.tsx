import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { SelectField, TextField } from '@/components/ui/field';
import { concentrationUnitChoices, type AssayConditionsValues } from '../lib/assay-form';

const unitOptions = concentrationUnitChoices.map((unit) => ({ value: unit, label: unit }));
const methodOptions = [
  { value: 'continuous', label: 'Continuous' },
  { value: 'discontinuous', label: 'Discontinuous' },
  { value: '', label: 'Not stated' },
];

/** The assay conditions: what STRENDA asks to be reported with every rate. */
export function ConditionsFields({ register, errors }: { register: UseFormRegister<AssayConditionsValues>; errors: FieldErrors<AssayConditionsValues> }) {
  return (
    <div className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-3">
        <div className="sm:col-span-3">
          <TextField label="Substrate" autoComplete="off" error={errors.substrate?.message} {...register('substrate')} />
        </div>
        <TextField label="Temperature (°C)" inputMode="decimal" error={errors.temperatureC?.message} {...register('temperatureC')} />
        <TextField label="pH" inputMode="decimal" error={errors.ph?.message} {...register('ph')} />
        <TextField label="Assay date" type="date" error={errors.assayDate?.message} {...register('assayDate')} />
        <TextField label="Buffer" placeholder="e.g. MES" autoComplete="off" error={errors.bufferName?.message} {...register('bufferName')} />
        <TextField label="Buffer (mM)" inputMode="decimal" error={errors.bufferMm?.message} {...register('bufferMm')} />
        <TextField label="Ionic strength (mM)" inputMode="decimal" hint="Optional" error={errors.ionicStrengthMm?.message} {...register('ionicStrengthMm')} />
        <TextField label="Metal salt" placeholder="e.g. ZnCl2" autoComplete="off" error={errors.metalSalt?.message} {...register('metalSalt')} />
        <TextField label="Metal salt concentration" inputMode="decimal" error={errors.metalValue?.message} {...register('metalValue')} />
        <SelectField label="Metal salt unit" options={unitOptions} error={errors.metalUnit?.message} {...register('metalUnit')} />
        <TextField label="Enzyme [E]t" inputMode="decimal" error={errors.enzymeValue?.message} {...register('enzymeValue')} />
        <SelectField label="[E]t unit" options={unitOptions} error={errors.enzymeUnit?.message} {...register('enzymeUnit')} />
        <SelectField label="Method" options={methodOptions} error={errors.method?.message} {...register('method')} />
        <div className="sm:col-span-3">
          <TextField label="Detection" placeholder="e.g. absorbance 405 nm, 4-nitroaniline released" autoComplete="off" error={errors.detection?.message} {...register('detection')} />
        </div>
        <div className="sm:col-span-3">
          <TextField label="Other components" placeholder="e.g. 0.1 mg/mL BSA, 2 % DMSO" autoComplete="off" error={errors.otherComponents?.message} {...register('otherComponents')} />
        </div>
        <div className="sm:col-span-3">
          <TextField label="Notes" autoComplete="off" error={errors.notes?.message} {...register('notes')} />
        </div>
      </div>
    </div>
  );
}
