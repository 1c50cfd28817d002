import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { digestReviewStates, maxDigestTopCount, updateDigestSettingsInput, type DigestSettingsDto, type UpdateDigestSettingsInput } from '@shared/schemas/digest';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateDigestSettings } from '../api/update-digest-settings';

const stateLabels: Record<(typeof digestReviewStates)[number], string> = {
  submitted: 'Submitted (waiting for review)',
  approved: 'Approved',
};

/** The lead's choices for a campaign's digest: which review states count and how long the ranking is. */
export function DigestSettingsForm({ settings }: { settings: DigestSettingsDto }) {
  const update = useUpdateDigestSettings();
  const form = useForm<z.input<typeof updateDigestSettingsInput>, unknown, UpdateDigestSettingsInput>({
    resolver: zodResolver(updateDigestSettingsInput),
    defaultValues: { version: settings.version, reviewStates: settings.reviewStates, topCount: settings.topCount },
  });
  const errors = form.formState.errors;

  useEffect(() => {
    form.reset({ version: settings.version, reviewStates: settings.reviewStates, topCount: settings.topCount });
  }, [form, settings]);

  const handleSubmit = form.handleSubmit((values) => {
    update.mutate({ campaignId: settings.campaignId, ...values }, { onError: (error) => applyServerErrors(error, form.setError) });
  });
  const failure = update.error instanceof ApiError && update.error.code === 'stale_version' ? update.error : null;

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-3" aria-label="Digest settings">
      {failure && <Notice tone="danger" title="Someone changed these settings first">{failure.message}</Notice>}
      {errors.root?.server && !failure && <Notice tone="danger" title={errors.root.server.message} />}
      {update.isSuccess && !form.formState.isDirty && <Notice tone="fine" title="Settings saved; the next digest uses them." />}
      <fieldset className="space-y-1">
        <legend className="text-sm font-medium text-ink-700">Rank on measurements that are</legend>
        {digestReviewStates.map((state) => (
          <label key={state} className="flex items-center gap-2 text-sm">
            <input type="checkbox" value={state} className="size-4 accent-lagoon-600" {...form.register('reviewStates')} />
            {stateLabels[state]}
          </label>
        ))}
        {errors.reviewStates && (
          <p className="flex items-center gap-1 text-sm text-signal-danger">
            <span aria-hidden>⚠</span> {errors.reviewStates.message ?? errors.reviewStates.root?.message}
          </p>
        )}
        <p className="text-xs text-ink-500">Drafts never count in a digest; flagged and retracted measurements never count anywhere.</p>
      </fieldset>
      <TextField
        label="Variants in the ranking"
        type="number"
        min={1}
        max={maxDigestTopCount}
        className="w-28"
        error={errors.topCount?.message}
        {...form.register('topCount', { valueAsNumber: true })}
      />
      <Button type="submit" busy={update.isPending}>
        Save settings
      </Button>
    </form>
  );
}
