import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { catalyticRoles, createCatalyticSiteInput, type CreateCatalyticSiteInput, type EnzymeDto } from '@shared/schemas/enzyme';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useAddSite } from '../api/add-site';
import { checkSite, residueAt } from '../site-check';

type FormValues = z.input<typeof createCatalyticSiteInput>;

const roleOptions = catalyticRoles.map((role) => ({ value: role, label: role.charAt(0).toUpperCase() + role.slice(1) }));
const optionalNumber = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));

interface AddSiteFormProps {
  enzyme: EnzymeDto;
  /** The position typed so far, for the map to point at. */
  onPositionChange: (position: number | undefined) => void;
}

/** Annotates one more residue; the residue is checked against the sequence as it is typed. */
export function AddSiteForm({ enzyme, onPositionChange }: AddSiteFormProps) {
  const addSite = useAddSite();
  const form = useForm<FormValues, unknown, CreateCatalyticSiteInput>({
    resolver: zodResolver(createCatalyticSiteInput),
    defaultValues: { position: undefined, residue: '', role: 'nucleophile', expectedPka: undefined, note: '' },
  });
  const errors = form.formState.errors;
  const position = form.watch('position');
  const residue = form.watch('residue');
  const check = checkSite(position, residue, enzyme.sequence);
  const here = residueAt(position, enzyme.sequence);

  useEffect(() => {
    onPositionChange(typeof position === 'number' && Number.isInteger(position) ? position : undefined);
  }, [position, onPositionChange]);

  const handleSubmit = form.handleSubmit((values) => {
    addSite.mutate(
      { enzymeId: enzyme.id, ...values },
      {
        onSuccess: () => form.reset(),
        onError: (error) => {
          if (error instanceof ApiError && error.code === 'conflict') form.setError('role', { message: error.message });
          else applyServerErrors(error, form.setError);
        },
      },
    );
  });

  const positionError = (check.kind === 'problem' && check.field === 'position' ? check.message : undefined) ?? errors.position?.message;
  const residueError = (check.kind === 'problem' && check.field === 'residue' ? check.message : undefined) ?? errors.residue?.message;

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-3 rounded-lg border border-paper-200 bg-paper-50 p-4" aria-labelledby="add-site-heading">
      <h3 id="add-site-heading" className="font-semibold">
        Annotate a residue
      </h3>
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      {addSite.isSuccess && <Notice tone="fine" title={`${addSite.data.residue}${addSite.data.position} annotated as ${addSite.data.role}.`} />}
      <div className="grid items-start gap-3 sm:grid-cols-[7rem_minmax(0,1fr)_minmax(0,1fr)_8rem]">
        <TextField label="Position" inputMode="numeric" className="font-mono" error={positionError} {...form.register('position', { setValueAs: optionalNumber })} />
        <TextField
          label="Residue"
          className="font-mono"
          autoComplete="off"
          placeholder="C or Cys"
          error={residueError}
          hint={!residueError && check.kind !== 'matches' && here ? `here: ${here}` : undefined}
          {...form.register('residue')}
        />
        <SelectField label="Role" options={roleOptions} error={errors.role?.message} {...form.register('role')} />
        <TextField label="Expected pKa" inputMode="decimal" className="font-mono" error={errors.expectedPka?.message} {...form.register('expectedPka', { setValueAs: optionalNumber })} />
      </div>
      {check.kind === 'matches' && (
        <p className="text-sm text-signal-fine" aria-live="polite">
          <span aria-hidden>✓ </span>
          {check.message}
        </p>
      )}
      <TextField label="Note (optional)" autoComplete="off" error={errors.note?.message} {...form.register('note')} />
      <Button type="submit" variant="primary" busy={addSite.isPending}>
        Add site
      </Button>
    </form>
  );
}
