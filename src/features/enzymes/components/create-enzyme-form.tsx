import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState, type ReactNode } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { createEnzymeInput, type CatalyticRole, type CreateEnzymeInput, type EnzymeDto } from '@shared/schemas/enzyme';
import { parseFasta } from '@shared/sequence/parse-fasta';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateEnzyme } from '../api/create-enzyme';
import { CofactorsField } from './cofactors-field';
import { SequenceField } from './sequence-field';
import { SiteRowsEditor } from './site-rows-editor';

type FormValues = z.input<typeof createEnzymeInput>;

/** What the route needs to draw the sequence map beside the form. */
export interface SequencePreview {
  sequence: string;
  sites: { position: number; role: CatalyticRole; expectedPka?: number | null; note?: string | null }[];
  highlightPosition?: number;
}

interface CreateEnzymeFormProps {
  onCreated: (enzyme: EnzymeDto) => void;
  /** Draws the sequence map (a feature of its own) for the sequence as typed. */
  renderPreview: (preview: SequencePreview) => ReactNode;
}

/** A new parent enzyme: identity, cofactors, the sequence (pasted or from FASTA) and its catalytic sites. */
export function CreateEnzymeForm({ onCreated, renderPreview }: CreateEnzymeFormProps) {
  const createEnzyme = useCreateEnzyme();
  const [focusedRow, setFocusedRow] = useState<number | undefined>();
  const form = useForm<FormValues, unknown, CreateEnzymeInput>({
    resolver: zodResolver(createEnzymeInput),
    defaultValues: { name: '', ecNumber: '', accession: '', organism: '', sequence: '', cofactors: [], otherCofactors: '', sites: [] },
  });
  const errors = form.formState.errors;
  const sequenceText = form.watch('sequence');
  const sites = form.watch('sites') ?? [];
  // The one-letter sequence when the text is one readable record, so sites can be checked against it.
  const sequence = useMemo(() => {
    const parsed = parseFasta(sequenceText);
    return parsed.ok && parsed.records.length === 1 ? parsed.records[0].sequence : '';
  }, [sequenceText]);
  const taken =
    createEnzyme.error instanceof ApiError && createEnzyme.error.code === 'conflict' && typeof createEnzyme.error.details.existingEnzymeId === 'number'
      ? createEnzyme.error.details.existingEnzymeId
      : null;

  const handleSubmit = form.handleSubmit((values) => {
    createEnzyme.mutate(values, {
      onSuccess: onCreated,
      onError: (error) => {
        if (error instanceof ApiError && error.code === 'conflict') form.setError('name', { message: 'is already taken by another enzyme' });
        else applyServerErrors(error, form.setError);
      },
    });
  });

  const previewSites = sites
    .filter((site) => Number.isInteger(site.position) && site.position >= 1 && site.position <= sequence.length)
    .map((site) => ({ position: site.position, role: site.role, expectedPka: site.expectedPka ?? null, note: site.note ?? null }));

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-6">
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      {taken !== null && (
        <Notice tone="caution" title="An enzyme with this name exists">
          <Link to={paths.enzyme.href(taken)} className="font-semibold text-lagoon-700 underline underline-offset-2">
            Open the existing enzyme
          </Link>{' '}
          or choose another name.
        </Notice>
      )}
      <section aria-labelledby="enzyme-identity" className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
        <h2 id="enzyme-identity" className="text-lg font-semibold">
          Identity
        </h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
          <TextField label="EC number" placeholder="3.5.1.4" className="font-mono" autoComplete="off" error={errors.ecNumber?.message} {...form.register('ecNumber')} />
          <TextField
            label="Accession (optional)"
            placeholder="UniProt-style, e.g. Q8ZNA1"
            className="font-mono"
            autoComplete="off"
            hint="Checked by pattern only; nothing is fetched."
            error={errors.accession?.message}
            {...form.register('accession')}
          />
          <TextField label="Organism" autoComplete="off" placeholder="or “synthetic construct”" error={errors.organism?.message} {...form.register('organism')} />
        </div>
        <Controller
          control={form.control}
          name="cofactors"
          render={({ field }) => <CofactorsField value={field.value ?? []} onChange={field.onChange} error={errors.cofactors?.message} />}
        />
        <TextField label="Other cofactors (optional)" autoComplete="off" error={errors.otherCofactors?.message} {...form.register('otherCofactors')} />
      </section>

      <section aria-labelledby="enzyme-sequence" className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
        <h2 id="enzyme-sequence" className="text-lg font-semibold">
          Sequence and catalytic sites
        </h2>
        <Controller
          control={form.control}
          name="sequence"
          render={({ field }) => <SequenceField value={field.value} onChange={field.onChange} error={errors.sequence?.message} />}
        />
        <SiteRowsEditor
          control={form.control}
          register={form.register}
          watch={form.watch}
          errors={errors}
          sequence={sequence}
          onFocusRow={setFocusedRow}
        />
        {sequence !== '' && renderPreview({ sequence, sites: previewSites, highlightPosition: focusedRow === undefined ? undefined : sites[focusedRow]?.position })}
      </section>

      <Button type="submit" variant="primary" busy={createEnzyme.isPending}>
        Create enzyme
      </Button>
    </form>
  );
}
