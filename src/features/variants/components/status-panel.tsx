import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { updateVariantInput, variantStatuses, type UpdateVariantInput, type VariantDto } from '@shared/schemas/variant';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { isStaleVersion, StaleVersionNotice } from '@/components/ui/stale-version-notice';
import { formatDateTime } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateVariant } from '../api/update-variant';
import { variantStatusLabels, VariantStatusBadge } from './variant-status-badge';

const statusOptions = variantStatuses.map((status) => ({ value: status, label: variantStatusLabels[status] }));

interface StatusPanelProps {
  variant: VariantDto;
  canEdit: boolean;
  onReload: () => void;
  onChanged?: (variant: VariantDto) => void;
}

/** The construct's status, the control to move it on (biologists and leads), and every change so far. */
export function StatusPanel({ variant, canEdit, onReload, onChanged }: StatusPanelProps) {
  const history = [...variant.statusHistory].reverse();
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <span className="text-ink-600">Now</span>
        <VariantStatusBadge status={variant.status} />
      </div>
      {canEdit && <StatusChangeForm key={variant.version} variant={variant} onReload={onReload} onChanged={onChanged} />}
      <div>
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-600">History</h3>
        {history.length === 0 ? (
          <p className="mt-1 text-sm text-ink-500">No status changes recorded.</p>
        ) : (
          <ol className="mt-2 space-y-2 border-l-2 border-paper-200 pl-3 text-sm">
            {history.map((change) => (
              <li key={`${change.at}-${change.status}`}>
                <p>
                  <span className="font-semibold">{variantStatusLabels[change.status]}</span>
                  {change.previousStatus ? (
                    <span className="text-ink-600"> from {variantStatusLabels[change.previousStatus].toLowerCase()}</span>
                  ) : (
                    <span className="text-ink-600"> when registered</span>
                  )}
                </p>
                <p className="text-xs text-ink-500">
                  {formatDateTime(change.at)}
                  {change.actor && <> · {change.actor.name}</>}
                </p>
              </li>
            ))}
          </ol>
        )}
      </div>
    </div>
  );
}

function StatusChangeForm({ variant, onReload, onChanged }: Omit<StatusPanelProps, 'canEdit'>) {
  const updateVariant = useUpdateVariant();
  const form = useForm<z.input<typeof updateVariantInput>, unknown, UpdateVariantInput>({
    resolver: zodResolver(updateVariantInput),
    defaultValues: { version: variant.version, status: variant.status },
  });
  const chosen = form.watch('status');

  const handleSubmit = form.handleSubmit((values) => {
    updateVariant.mutate(
      { id: variant.id, version: values.version, status: values.status },
      {
        onSuccess: (updated) => onChanged?.(updated),
        onError: (error) => {
          if (!isStaleVersion(error)) applyServerErrors(error, form.setError);
        },
      },
    );
  });

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-2">
      {isStaleVersion(updateVariant.error) && (
        <StaleVersionNotice
          what="variant"
          onReload={() => {
            updateVariant.reset();
            onReload();
          }}
        />
      )}
      {form.formState.errors.root?.server && <Notice tone="danger" title={form.formState.errors.root.server.message} />}
      <div className="flex items-end gap-2">
        <div className="flex-1">
          <SelectField label="Change status to" options={statusOptions} error={form.formState.errors.status?.message} {...form.register('status')} />
        </div>
        <Button type="submit" variant="primary" busy={updateVariant.isPending} disabled={chosen === variant.status}>
          Save status
        </Button>
      </div>
    </form>
  );
}
