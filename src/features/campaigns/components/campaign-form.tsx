import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type UseFormRegisterReturn } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import {
  campaignStatuses,
  createCampaignInput,
  updateCampaignInput,
  type CampaignDto,
  type CreateCampaignInput,
  type PersonRefDto,
  type UpdateCampaignInput,
} from '@shared/schemas/campaign';
import type { EnzymeSummaryDto } from '@shared/schemas/enzyme';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { isStaleVersion, StaleVersionNotice } from '@/components/ui/stale-version-notice';
import { TextAreaField } from '@/components/ui/text-area-field';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateCampaign } from '../api/create-campaign';
import { useUpdateCampaign } from '../api/update-campaign';

const statusOptions = campaignStatuses.map((status) => ({ value: status, label: status.charAt(0).toUpperCase() + status.slice(1) }));

const toNumber = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));
// The lead select uses '' for "nobody", which the API writes as null.
const toLeadId = (value: unknown) => (value === '' || value === null ? null : Number(value));

function leadOptions(candidates: readonly PersonRefDto[], current: PersonRefDto | null) {
  const people = current && !candidates.some((person) => person.id === current.id) ? [current, ...candidates] : candidates;
  return [{ value: '', label: 'No lead' }, ...people.map((person) => ({ value: String(person.id), label: person.name }))];
}

interface CreateCampaignFormProps {
  enzymes: readonly EnzymeSummaryDto[];
  leads: readonly PersonRefDto[];
  initialEnzymeId?: number;
  /** The person creating it, who leads it unless another lead is chosen. */
  meId: number;
  onCreated: (campaign: CampaignDto) => void;
}

/** A new campaign on a parent enzyme; its parent variant (the enzyme itself) is created with it. */
export function CreateCampaignForm({ enzymes, leads, initialEnzymeId, meId, onCreated }: CreateCampaignFormProps) {
  const createCampaign = useCreateCampaign();
  const form = useForm<z.input<typeof createCampaignInput>, unknown, CreateCampaignInput>({
    resolver: zodResolver(createCampaignInput),
    defaultValues: {
      name: '',
      objective: '',
      enzymeId: enzymes.some((enzyme) => enzyme.id === initialEnzymeId) ? initialEnzymeId : undefined,
      targetSubstrate: '',
      targetPh: undefined,
      targetTemperatureC: undefined,
      leadId: leads.some((person) => person.id === meId) ? meId : null,
      status: 'active',
    },
  });
  const errors = form.formState.errors;
  const taken = createCampaign.error instanceof ApiError && createCampaign.error.code === 'conflict' ? Number(createCampaign.error.details.existingCampaignId) : null;

  const handleSubmit = form.handleSubmit((values) => {
    createCampaign.mutate(values, {
      onSuccess: onCreated,
      onError: (error) => {
        if (error instanceof ApiError && error.code === 'conflict') form.setError('name', { message: 'is already taken by another campaign' });
        else applyServerErrors(error, form.setError);
      },
    });
  });

  const enzymeOptions = [{ value: '', label: 'Choose the parent enzyme…' }, ...enzymes.map((enzyme) => ({ value: String(enzyme.id), label: `${enzyme.name} (${enzyme.sequenceLength} residues)` }))];

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      {taken !== null && Number.isFinite(taken) && (
        <Notice tone="caution" title="A campaign with this name exists">
          <Link to={paths.campaign.href(taken)} className="font-semibold text-lagoon-700 underline underline-offset-2">
            Open it
          </Link>{' '}
          or choose another name.
        </Notice>
      )}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <SelectField
        label="Parent enzyme"
        options={enzymeOptions}
        error={errors.enzymeId && form.getValues('enzymeId') === undefined ? 'choose the enzyme the campaign works on' : errors.enzymeId?.message}
        {...form.register('enzymeId', { setValueAs: toNumber })}
      />
      <TextAreaField label="Objective" rows={3} hint="One or two sentences on what the campaign is to achieve." error={errors.objective?.message} {...form.register('objective')} />
      <TargetFields
        substrate={form.register('targetSubstrate')}
        ph={form.register('targetPh', { setValueAs: toNumber })}
        temperature={form.register('targetTemperatureC', { setValueAs: toNumber })}
        errors={errors}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Lead" options={leadOptions(leads, null)} error={errors.leadId?.message} {...form.register('leadId', { setValueAs: toLeadId })} />
        <SelectField label="Status" options={statusOptions} error={errors.status?.message} {...form.register('status')} />
      </div>
      <Button type="submit" variant="primary" busy={createCampaign.isPending}>
        Create campaign
      </Button>
    </form>
  );
}

interface TargetFieldsProps {
  substrate: UseFormRegisterReturn;
  ph: UseFormRegisterReturn;
  temperature: UseFormRegisterReturn;
  errors: { targetSubstrate?: { message?: string }; targetPh?: { message?: string }; targetTemperatureC?: { message?: string } };
}

/** The campaign's target conditions, which decide each variant's primary comparison. */
function TargetFields({ substrate, ph, temperature, errors }: TargetFieldsProps) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_10rem_12rem]">
      <legend className="sr-only">Target conditions</legend>
      <TextField label="Target substrate" autoComplete="off" error={errors.targetSubstrate?.message} {...substrate} />
      <TextField label="Target pH" inputMode="decimal" className="font-mono" error={errors.targetPh?.message} {...ph} />
      <TextField label="Target temperature (°C)" inputMode="decimal" className="font-mono" error={errors.targetTemperatureC?.message} {...temperature} />
    </fieldset>
  );
}

interface EditCampaignFormProps {
  campaign: CampaignDto;
  leads: readonly PersonRefDto[];
  onDone: () => void;
  onReload: () => void;
}

/** A lead's changes to the campaign's settings; the parent enzyme stays, as every variant refers to it. */
export function EditCampaignForm({ campaign, leads, onDone, onReload }: EditCampaignFormProps) {
  const updateCampaign = useUpdateCampaign();
  const form = useForm<z.input<typeof updateCampaignInput>, unknown, UpdateCampaignInput>({
    resolver: zodResolver(updateCampaignInput),
    defaultValues: {
      version: campaign.version,
      name: campaign.name,
      objective: campaign.objective,
      targetSubstrate: campaign.targetSubstrate,
      targetPh: campaign.targetPh,
      targetTemperatureC: campaign.targetTemperatureC,
      leadId: campaign.leadId,
      status: campaign.status,
    },
  });
  const errors = form.formState.errors;

  const handleSubmit = form.handleSubmit((values) => {
    updateCampaign.mutate(
      { id: campaign.id, ...values },
      {
        onSuccess: onDone,
        onError: (error) => {
          if (isStaleVersion(error)) return;
          if (error instanceof ApiError && error.code === 'conflict') form.setError('name', { message: 'is already taken by another campaign' });
          else applyServerErrors(error, form.setError);
        },
      },
    );
  });

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4">
      {isStaleVersion(updateCampaign.error) && (
        <StaleVersionNotice
          what="campaign"
          onReload={() => {
            onDone();
            onReload();
          }}
        />
      )}
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <TextAreaField label="Objective" rows={3} error={errors.objective?.message} {...form.register('objective')} />
      <TargetFields
        substrate={form.register('targetSubstrate')}
        ph={form.register('targetPh', { setValueAs: toNumber })}
        temperature={form.register('targetTemperatureC', { setValueAs: toNumber })}
        errors={errors}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Lead" options={leadOptions(leads, campaign.lead)} error={errors.leadId?.message} {...form.register('leadId', { setValueAs: toLeadId })} />
        <SelectField label="Status" options={statusOptions} error={errors.status?.message} {...form.register('status')} />
      </div>
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={updateCampaign.isPending}>
          Save settings
        </Button>
        <Button onClick={onDone}>Cancel</Button>
      </div>
    </form>
  );
}
