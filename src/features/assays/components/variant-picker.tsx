import { useDeferredValue, useState } from 'react';
import { SelectField, TextField } from '@/components/ui/field';
import { useCampaigns } from '../api/get-campaigns';
import { useVariant } from '../api/get-variant';
import { useVariantOptions } from '../api/get-variant-options';

export interface VariantPickerProps {
  campaignId: number | null;
  onCampaignChange: (campaignId: number | null) => void;
  variantId: string;
  onVariantChange: (variantId: string) => void;
  error?: string;
}

/** Campaign, then variant: the variant list follows the campaign and a search over labels and notes. */
export function VariantPicker({ campaignId, onCampaignChange, variantId, onVariantChange, error }: VariantPickerProps) {
  const campaigns = useCampaigns();
  const [search, setSearch] = useState('');
  const deferredSearch = useDeferredValue(search);
  const options = useVariantOptions(campaignId, deferredSearch);
  const selected = useVariant(variantId === '' ? null : Number(variantId));

  const campaignOptions = [
    { value: '', label: campaigns.isPending ? 'Loading campaigns…' : 'Choose a campaign' },
    ...(campaigns.data?.rows ?? []).map((campaign) => ({ value: String(campaign.id), label: campaign.name })),
  ];
  const rows = options.data?.rows ?? [];
  const variantOptions = [
    { value: '', label: campaignId === null ? 'Choose a campaign first' : options.isPending ? 'Loading variants…' : 'Choose a variant' },
    // The chosen variant stays listed even when the search would hide it.
    ...(selected.data && !rows.some((row) => row.id === selected.data.id) ? [{ value: String(selected.data.id), label: selected.data.label }] : []),
    ...rows.map((row) => ({ value: String(row.id), label: row.isParent ? `${row.label} (parent)` : row.label })),
  ];
  const total = options.data?.total ?? 0;

  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <SelectField
        label="Campaign"
        options={campaignOptions}
        value={campaignId === null ? '' : String(campaignId)}
        onChange={(event) => {
          onCampaignChange(event.target.value === '' ? null : Number(event.target.value));
          onVariantChange('');
        }}
        error={campaigns.isError ? 'The campaigns could not be loaded.' : undefined}
        />
      </div>
      <TextField label="Find a variant" placeholder="e.g. Y87F" value={search} onChange={(event) => setSearch(event.target.value)} disabled={campaignId === null} />
      <SelectField
        label="Variant"
        options={variantOptions}
        value={variantId}
        onChange={(event) => onVariantChange(event.target.value)}
        error={error ?? (options.isError ? 'The variants could not be loaded.' : undefined)}
        hint={total > rows.length ? `The first ${rows.length} of ${total}; search to narrow.` : undefined}
        disabled={campaignId === null}
      />
    </div>
  );
}
