import { zodResolver } from '@hookform/resolvers/zod';
import { Controller, useForm } from 'react-hook-form';
import type { z } from 'zod';
import { updateEnzymeInput, type EnzymeDto, type UpdateEnzymeInput } from '@shared/schemas/enzyme';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { isStaleVersion, StaleVersionNotice } from '@/components/ui/stale-version-notice';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateEnzyme } from '../api/update-enzyme';
import { CofactorsField } from './cofactors-field';
import { SequenceField } from './sequence-field';

type FormValues = z.input<typeof updateEnzymeInput>;

interface EditEnzymeFormProps {
  enzyme: EnzymeDto;
  onDone: () => void;
  onReload: () => void;
}

/**
 * Changes to an enzyme's identity and sequence. A new sequence is refused by the server while an annotated
 * site or a registered mutation would no longer match it; its message names them.
 */
export function EditEnzymeForm({ enzyme, onDone, onReload }: EditEnzymeFormProps) {
  const updateEnzyme = useUpdateEnzyme();
  const form = useForm<FormValues, unknown, UpdateEnzymeInput>({
    resolver: zodResolver(updateEnzymeInput),
    defaultValues: {
      version: enzyme.version,
      name: enzyme.name,
      ecNumber: enzyme.ecNumber ?? '',
      accession: enzyme.accession ?? '',
      organism: enzyme.organism,
      sequence: enzyme.sequence,
      cofactors: enzyme.cofactors,
      otherCofactors: enzyme.otherCofactors ?? '',
    },
  });
  const errors = form.formState.errors;

  const handleSubmit = form.handleSubmit((values) => {
    updateEnzyme.mutate(
      { id: enzyme.id, ...values },
      {
        onSuccess: onDone,
        onError: (error) => {
          if (isStaleVersion(error)) return;
          if (error instanceof ApiError && error.code === 'conflict') form.setError('name', { message: 'is already taken by another enzyme' });
          else applyServerErrors(error, form.setError);
        },
      },
    );
  });

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4">
      {isStaleVersion(updateEnzyme.error) && (
        <StaleVersionNotice
          what="enzyme"
          onReload={() => {
            onDone();
            onReload();
          }}
        />
      )}
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
        <TextField label="EC number" className="font-mono" autoComplete="off" error={errors.ecNumber?.message} {...form.register('ecNumber')} />
        <TextField label="Accession (optional)" className="font-mono" autoComplete="off" error={errors.accession?.message} {...form.register('accession')} />
        <TextField label="Organism" autoComplete="off" error={errors.organism?.message} {...form.register('organism')} />
      </div>
      <Controller
        control={form.control}
        name="cofactors"
        render={({ field }) => <CofactorsField value={field.value ?? []} onChange={field.onChange} error={errors.cofactors?.message} />}
      />
      <TextField label="Other cofactors (optional)" autoComplete="off" error={errors.otherCofactors?.message} {...form.register('otherCofactors')} />
      <Controller
        control={form.control}
        name="sequence"
        render={({ field }) => <SequenceField value={field.value ?? ''} onChange={field.onChange} error={errors.sequence?.message} />}
      />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={updateEnzyme.isPending}>
          Save changes
        </Button>
        <Button onClick={onDone}>Cancel</Button>
      </div>
    </form>
  );
}
