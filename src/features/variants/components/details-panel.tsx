import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { updateVariantInput, type UpdateVariantInput, type VariantDto } from '@shared/schemas/variant';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { isStaleVersion, StaleVersionNotice } from '@/components/ui/stale-version-notice';
import { TextAreaField } from '@/components/ui/text-area-field';
import { formatDateTime } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateVariant } from '../api/update-variant';

interface DetailsPanelProps {
  variant: VariantDto;
  canEdit: boolean;
  onReload: () => void;
}

/** Construct id, notes and who registered the variant; biologists and leads may edit the first two. */
export function DetailsPanel({ variant, canEdit, onReload }: DetailsPanelProps) {
  const [editing, setEditing] = useState(false);
  if (editing) return <DetailsForm key={variant.version} variant={variant} onReload={onReload} onClose={() => setEditing(false)} />;
  return (
    <div className="space-y-3 text-sm">
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1.5">
        <dt className="text-ink-600">Construct</dt>
        <dd className="font-mono">{variant.constructId ?? <span className="font-sans text-ink-500">not recorded</span>}</dd>
        <dt className="text-ink-600">Registered</dt>
        <dd>
          {formatDateTime(variant.createdAt)}
          {variant.createdBy && <> by {variant.createdBy.name}</>}
        </dd>
        <dt className="text-ink-600">Changed</dt>
        <dd>
          {formatDateTime(variant.updatedAt)} <span className="text-ink-500">(version {variant.version})</span>
        </dd>
      </dl>
      <div>
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-600">Notes</h3>
        <p className="mt-1 whitespace-pre-line text-ink-700">{variant.notes ?? <span className="text-ink-500">No notes.</span>}</p>
      </div>
      {canEdit && (
        <Button onClick={() => setEditing(true)} className="px-2.5 py-1">
          Edit construct and notes
        </Button>
      )}
    </div>
  );
}

function DetailsForm({ variant, onReload, onClose }: { variant: VariantDto; onReload: () => void; onClose: () => void }) {
  const updateVariant = useUpdateVariant();
  const form = useForm<z.input<typeof updateVariantInput>, unknown, UpdateVariantInput>({
    resolver: zodResolver(updateVariantInput),
    defaultValues: { version: variant.version, constructId: variant.constructId ?? '', notes: variant.notes ?? '' },
  });
  const errors = form.formState.errors;

  const handleSubmit = form.handleSubmit((values) => {
    updateVariant.mutate(
      { id: variant.id, version: values.version, constructId: values.constructId, notes: values.notes },
      {
        onSuccess: onClose,
        onError: (error) => {
          if (!isStaleVersion(error)) applyServerErrors(error, form.setError);
        },
      },
    );
  });

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-3">
      {isStaleVersion(updateVariant.error) && (
        <StaleVersionNotice
          what="variant"
          onReload={() => {
            onClose();
            onReload();
          }}
        />
      )}
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      <TextField label="Construct id" className="font-mono" error={errors.constructId?.message} {...form.register('constructId')} />
      <TextAreaField label="Notes" rows={4} error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={updateVariant.isPending}>
          Save
        </Button>
        <Button onClick={onClose}>Cancel</Button>
      </div>
    </form>
  );
}
