import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { parseMutations, type MutationParseResult } from '@shared/mutations/parse-mutations';
import type { CampaignDto } from '@shared/schemas/campaign';
import type { CatalyticRole } from '@shared/schemas/enzyme';
import { createVariantInput, variantStatuses, type CreateVariantInput, type VariantDto } from '@shared/schemas/variant';
import { Button, Spinner } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { TextAreaField } from '@/components/ui/text-area-field';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateVariant } from '../api/create-variant';
import { useVariants } from '../api/get-variants';
import { variantStatusLabels } from './variant-status-badge';

type FormValues = z.input<typeof createVariantInput>;

const statusOptions = variantStatuses.map((status) => ({ value: status, label: variantStatusLabels[status] }));

// Enough lineage parents to pick from in a select; a larger campaign is narrowed with the search box.
const lineageChoices = 200;

export interface ParentEnzyme {
  name: string;
  sequence: string;
  sites: readonly { position: number; role: CatalyticRole }[];
}

interface RegisterVariantFormProps {
  campaigns: readonly CampaignDto[];
  /** The chosen campaign's parent enzyme; undefined while it loads. */
  parentEnzyme: ParentEnzyme | undefined;
  initialCampaignId?: number;
  onCampaignChange: (campaignId: number | undefined) => void;
  onCreated: (variant: VariantDto) => void;
}

/**
 * Registers a variant on a campaign's parent. The mutation text is parsed as it is typed with the same
 * parser the server uses, so a wrong parent residue or position shows under the field before saving.
 */
export function RegisterVariantForm({ campaigns, parentEnzyme, initialCampaignId, onCampaignChange, onCreated }: RegisterVariantFormProps) {
  const createVariant = useCreateVariant();
  const open = campaigns.filter((campaign) => campaign.status !== 'closed');
  const startCampaign = open.find((campaign) => campaign.id === initialCampaignId) ?? (open.length === 1 ? open[0] : undefined);
  const form = useForm<FormValues, unknown, CreateVariantInput>({
    resolver: zodResolver(createVariantInput),
    defaultValues: {
      campaignId: startCampaign?.id ?? (0 as number),
      mutations: '',
      parentVariantId: null,
      constructId: '',
      status: 'designed',
      notes: '',
    },
  });
  const errors = form.formState.errors;
  const campaignId = Number(form.watch('campaignId')) || undefined;
  const text = form.watch('mutations');
  const parsed = useMemo(
    () => (parentEnzyme && text.trim() !== '' ? parseMutations(text, { parentSequence: parentEnzyme.sequence }) : null),
    [text, parentEnzyme],
  );
  const duplicate =
    createVariant.error instanceof ApiError && createVariant.error.code === 'duplicate_variant'
      ? { id: Number(createVariant.error.details.existingVariantId), label: String(createVariant.error.details.label ?? '') }
      : null;

  const campaignField = form.register('campaignId', {
    setValueAs: (value: string | number) => Number(value),
    onChange: (event: { target: { value: string } }) => {
      form.setValue('parentVariantId', null);
      createVariant.reset();
      onCampaignChange(Number(event.target.value) || undefined);
    },
  });

  const handleSubmit = form.handleSubmit((values) => {
    if (!parentEnzyme) return;
    const check = parseMutations(values.mutations, { parentSequence: parentEnzyme.sequence });
    if (!check.ok) {
      form.setError('mutations', { message: check.problems.map((problem) => `${problem.token}: ${problem.message}`).join('; ') });
      return;
    }
    createVariant.mutate(values, { onSuccess: onCreated, onError: (error) => applyServerErrors(error, form.setError) });
  });

  const campaignOptions = [
    { value: '0', label: 'Choose a campaign…' },
    ...open.map((campaign) => ({ value: String(campaign.id), label: `${campaign.name} (on ${campaign.enzyme.name})` })),
  ];

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-5 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      {errors.root?.server && !duplicate && <Notice tone="danger" title={errors.root.server.message} />}
      {duplicate && (
        <Notice tone="caution" title="This variant is already registered">
          <p>
            The same substitutions on the same parent are one variant.{' '}
            <Link to={paths.variant.href(duplicate.id)} className="font-semibold text-lagoon-700 underline underline-offset-2">
              Open {duplicate.label || `variant ${duplicate.id}`}
            </Link>
          </p>
        </Notice>
      )}
      <SelectField
        label="Campaign"
        options={campaignOptions}
        error={errors.campaignId ? 'choose the campaign the variant belongs to' : undefined}
        hint={parentEnzyme ? `Mutations are read against ${parentEnzyme.name} (${parentEnzyme.sequence.length} residues).` : undefined}
        {...campaignField}
      />

      <div className="space-y-1">
        <TextField
          label="Mutations"
          className="font-mono"
          autoComplete="off"
          spellCheck={false}
          placeholder="e.g. Y87D/R215K"
          disabled={!campaignId}
          error={errors.mutations?.message}
          hint={campaignId ? undefined : 'Choose a campaign first: its parent sequence checks each substitution.'}
          {...form.register('mutations', { onChange: () => createVariant.reset() })}
        />
        {campaignId !== undefined && <MutationFeedback parsed={parsed} loading={!parentEnzyme} sites={parentEnzyme?.sites ?? []} />}
      </div>

      {campaignId !== undefined && (
        <LineageParentField
          campaignId={campaignId}
          value={form.watch('parentVariantId') ?? null}
          error={errors.parentVariantId?.message}
          onChange={(id) => form.setValue('parentVariantId', id)}
        />
      )}

      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Construct id" className="font-mono" autoComplete="off" placeholder="e.g. pKC-142" error={errors.constructId?.message} {...form.register('constructId')} />
        <SelectField label="Status" options={statusOptions} error={errors.status?.message} {...form.register('status')} />
      </div>
      <TextAreaField label="Notes" rows={3} error={errors.notes?.message} {...form.register('notes')} />
      <Button type="submit" variant="primary" busy={createVariant.isPending} disabled={!parentEnzyme}>
        Register variant
      </Button>
    </form>
  );
}

const roleText = (role: CatalyticRole) => role.charAt(0).toUpperCase() + role.slice(1);

/** What the parser makes of the text so far: every problem, or the canonical label and HGVS it will store. */
function MutationFeedback({ parsed, loading, sites }: { parsed: MutationParseResult | null; loading: boolean; sites: ParentEnzyme['sites'] }) {
  if (loading) {
    return (
      <p className="text-sm text-ink-500">
        <Spinner label="Loading the parent sequence…" />
      </p>
    );
  }
  return (
    <div aria-live="polite" id="mutation-feedback">
      {parsed === null ? (
        <p className="text-sm text-ink-500">One-letter (C112A), three-letter (Cys112Ala) or HGVS (p.[Cys112Ala;His190Asn]); separate several with / or spaces.</p>
      ) : !parsed.ok ? (
        <ul className="space-y-0.5 text-sm text-signal-danger">
          {parsed.problems.map((problem) => (
            <li key={`${problem.token}-${problem.message}`} className="flex gap-1.5">
              <span aria-hidden>⚠</span>
              <span>
                <span className="font-mono font-semibold">{problem.token}</span>: {problem.message}
              </span>
            </li>
          ))}
        </ul>
      ) : parsed.value.mutations.length === 0 ? (
        <p className="text-sm text-signal-caution">
          <span aria-hidden>! </span>That is the parent itself, which the campaign already has.
        </p>
      ) : (
        <div className="rounded-md bg-lagoon-50 px-3 py-2 text-sm text-lagoon-900">
          <p>
            <span aria-hidden>✓ </span>Reads as <span className="font-mono font-semibold">{parsed.value.label}</span> ·{' '}
            <span className="font-mono">{parsed.value.hgvs}</span>
          </p>
          {parsed.value.mutations.some((mutation) => sites.some((site) => site.position === mutation.position)) && (
            <p className="mt-0.5 text-xs">
              Changes annotated{' '}
              {parsed.value.mutations
                .flatMap((mutation) =>
                  sites.filter((site) => site.position === mutation.position).map((site) => `${mutation.from}${mutation.position} (${roleText(site.role).toLowerCase()})`),
                )
                .join(', ')}
              .
            </p>
          )}
        </div>
      )}
    </div>
  );
}

function LineageParentField({
  campaignId,
  value,
  error,
  onChange,
}: {
  campaignId: number;
  value: number | null;
  error?: string;
  onChange: (id: number | null) => void;
}) {
  const [search, setSearch] = useState('');
  const variants = useVariants({ campaignId, q: search.trim() || undefined, sort: 'label', pageSize: lineageChoices });
  const rows = (variants.data?.rows ?? []).filter((row) => !row.isParent);
  const options = [
    { value: '', label: 'The campaign’s parent (no parent variant)' },
    ...rows.map((row) => ({ value: String(row.id), label: row.label })),
  ];
  // Keep a chosen variant in the list while the search text no longer matches it.
  if (value !== null && !rows.some((row) => row.id === value)) options.push({ value: String(value), label: `variant ${value}` });
  return (
    <fieldset className="space-y-2">
      <legend className="text-sm font-medium text-ink-700">Made from (lineage)</legend>
      <div className="grid gap-2 sm:grid-cols-[1fr_14rem]">
        <SelectField
          label="Parent variant"
          options={options}
          value={value === null ? '' : String(value)}
          error={error}
          onChange={(event) => onChange(event.target.value === '' ? null : Number(event.target.value))}
        />
        <TextField label="Find by label" type="search" value={search} onChange={(event) => setSearch(event.target.value)} placeholder="e.g. Y87D" />
      </div>
      {variants.isError && <p className="text-sm text-signal-danger">The campaign&apos;s variants could not be loaded: {variants.error.message}</p>}
      {variants.data && variants.data.total > lineageChoices && (
        <p className="text-xs text-ink-500">
          Showing {lineageChoices} of {variants.data.total} variants by label; type part of a label to find another.
        </p>
      )}
    </fieldset>
  );
}
