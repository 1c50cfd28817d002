import { useFieldArray, type Control, type FieldErrors, type UseFormRegister, type UseFormWatch } from 'react-hook-form';
import type { z } from 'zod';
import { catalyticRoles, type createEnzymeInput } from '@shared/schemas/enzyme';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { checkSite, residueAt } from '../site-check';

type EnzymeFormValues = z.input<typeof createEnzymeInput>;

const roleOptions = catalyticRoles.map((role) => ({ value: role, label: role.charAt(0).toUpperCase() + role.slice(1) }));

const optionalNumber = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));

interface SiteRowsEditorProps {
  control: Control<EnzymeFormValues, unknown, z.output<typeof createEnzymeInput>>;
  register: UseFormRegister<EnzymeFormValues>;
  watch: UseFormWatch<EnzymeFormValues>;
  errors: FieldErrors<EnzymeFormValues>;
  /** The sequence as read so far (one-letter, upper case), '' when it cannot be read yet. */
  sequence: string;
  /** The row being worked on, so the map can point at its position. */
  onFocusRow: (index: number) => void;
}

/** Catalytic sites typed with the new enzyme; each row is checked against the sequence as it is typed. */
export function SiteRowsEditor({ control, register, watch, errors, sequence, onFocusRow }: SiteRowsEditorProps) {
  const { fields, append, remove } = useFieldArray({ control, name: 'sites' });
  const sites = watch('sites') ?? [];
  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-medium text-ink-700">Catalytic sites</legend>
      {fields.length === 0 && <p className="text-sm text-ink-500">No sites yet. Annotate the residues that act in catalysis; each is checked against the sequence.</p>}
      {fields.map((field, index) => {
        const site = sites[index];
        const check = checkSite(site?.position, site?.residue, sequence);
        const rowErrors = errors.sites?.[index];
        const positionError = (check.kind === 'problem' && check.field === 'position' ? check.message : undefined) ?? rowErrors?.position?.message;
        const residueError = (check.kind === 'problem' && check.field === 'residue' ? check.message : undefined) ?? rowErrors?.residue?.message;
        const hint = residueAt(site?.position, sequence);
        return (
          <fieldset key={field.id} className="rounded-md border border-paper-200 bg-paper-50 p-3" aria-label={`Site ${index + 1}`} onFocus={() => onFocusRow(index)}>
            <div className="grid items-start gap-3 sm:grid-cols-[7rem_minmax(0,1fr)_minmax(0,1fr)_8rem_auto]">
              <TextField
                label="Position"
                inputMode="numeric"
                className="font-mono"
                error={positionError}
                {...register(`sites.${index}.position`, { setValueAs: optionalNumber })}
              />
              <TextField
                label="Residue"
                className="font-mono"
                autoComplete="off"
                placeholder="C or Cys"
                error={residueError}
                hint={!residueError && check.kind !== 'matches' && hint ? `here: ${hint}` : undefined}
                {...register(`sites.${index}.residue`)}
              />
              <SelectField label="Role" options={roleOptions} error={rowErrors?.role?.message} {...register(`sites.${index}.role`)} />
              <TextField label="Expected pKa" inputMode="decimal" className="font-mono" error={rowErrors?.expectedPka?.message} {...register(`sites.${index}.expectedPka`, { setValueAs: optionalNumber })} />
              <Button className="mt-6 px-2.5 py-1.5" aria-label={`Remove site ${index + 1}`} onClick={() => remove(index)}>
                Remove
              </Button>
            </div>
            <div className="mt-3">
              <TextField label="Note (optional)" autoComplete="off" error={rowErrors?.note?.message} {...register(`sites.${index}.note`)} />
            </div>
            {check.kind === 'matches' && (
              <p className="mt-2 text-sm text-signal-fine" aria-live="polite">
                <span aria-hidden>✓ </span>
                {check.message}
              </p>
            )}
          </fieldset>
        );
      })}
      {/* A new row starts with an empty position; the schema refuses it with its own message until one is typed. */}
      <Button onClick={() => append({ position: undefined as unknown as number, residue: '', role: 'nucleophile' })}>Add a site</Button>
    </fieldset>
  );
}
