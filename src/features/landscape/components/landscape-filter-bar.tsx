import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { catalyticRoles } from '@shared/schemas/enzyme';
import { variantStatuses, type VariantStatus } from '@shared/schemas/variant';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { useCampaigns } from '../api/get-campaigns';
import { filtersToSearch, type LandscapeFilters } from '../lib/landscape-filters';

interface DraftFilters {
  status: VariantStatus[];
  role: string;
  minFoldChange: string;
  position: string;
  residue: string;
  ddgMin: string;
  ddgMax: string;
  q: string;
}

function toDraft(filters: LandscapeFilters): DraftFilters {
  return {
    status: filters.status ?? [],
    role: filters.role ?? '',
    minFoldChange: filters.minFoldChange?.toString() ?? '',
    position: filters.position?.toString() ?? '',
    residue: filters.residue ?? '',
    ddgMin: filters.ddgMin?.toString() ?? '',
    ddgMax: filters.ddgMax?.toString() ?? '',
    q: filters.q ?? '',
  };
}

/**
 * The campaign and the variant filters, kept in the URL under the registry's parameter names so a view can
 * be shared and opened in the registry. Text fields apply on "Apply" (the URL then carries exactly what is
 * shown); the API's schema checks the values when the page reads them back.
 */
export function LandscapeFilterBar({ filters, onChange, problems }: { filters: LandscapeFilters; onChange: (search: string) => void; problems: readonly string[] }) {
  const campaigns = useCampaigns();
  const [draft, setDraft] = useState<DraftFilters>(() => toDraft(filters));
  const [appliedKey, setAppliedKey] = useState(() => filtersToSearch(filters));
  const currentKey = filtersToSearch(filters);
  // Back and forward change the URL under the form: take the URL's filters over.
  if (currentKey !== appliedKey) {
    setAppliedKey(currentKey);
    setDraft(toDraft(filters));
  }

  const apply = (next: DraftFilters, campaignId = filters.campaignId) => {
    const search = new URLSearchParams();
    if (campaignId !== undefined) search.set('campaignId', String(campaignId));
    if (next.status.length > 0) search.set('status', next.status.join(','));
    for (const name of ['role', 'minFoldChange', 'position', 'residue', 'ddgMin', 'ddgMax', 'q'] as const) {
      if (next[name].trim() !== '') search.set(name, next[name].trim());
    }
    onChange(search.toString());
  };
  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    apply(draft);
  };
  const toggleStatus = (status: VariantStatus) => {
    const next = { ...draft, status: draft.status.includes(status) ? draft.status.filter((item) => item !== status) : [...draft.status, status] };
    setDraft(next);
    apply(next);
  };

  const campaignOptions = [
    ...(filters.campaignId === undefined ? [{ value: '', label: campaigns.isPending ? 'Loading campaigns…' : 'Choose a campaign' }] : []),
    ...(campaigns.data?.rows ?? []).map((campaign) => ({ value: String(campaign.id), label: campaign.name })),
  ];
  const registrySearch = filtersToSearch(filters);

  return (
    <form onSubmit={handleSubmit} className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card" aria-label="Landscape filters">
      <div className="grid gap-3 md:grid-cols-[2fr_1fr_1fr_1fr]">
        <SelectField
          label="Campaign"
          options={campaignOptions}
          value={filters.campaignId === undefined ? '' : String(filters.campaignId)}
          onChange={(event) => apply(draft, event.target.value === '' ? undefined : Number(event.target.value))}
        />
        <SelectField
          label="Catalytic role at the mutated site"
          options={[{ value: '', label: 'Any' }, ...catalyticRoles.map((role) => ({ value: role, label: role }))]}
          value={draft.role}
          onChange={(event) => {
            const next = { ...draft, role: event.target.value };
            setDraft(next);
            apply(next);
          }}
        />
        <TextField label="Fold change at least" inputMode="decimal" placeholder="e.g. 1.5" value={draft.minFoldChange} onChange={(event) => setDraft({ ...draft, minFoldChange: event.target.value })} />
        <TextField label="Search" placeholder="label, e.g. Y87" value={draft.q} onChange={(event) => setDraft({ ...draft, q: event.target.value })} />
        <TextField label="Position" inputMode="numeric" value={draft.position} onChange={(event) => setDraft({ ...draft, position: event.target.value })} />
        <TextField label="Residue" placeholder="e.g. H or His" value={draft.residue} onChange={(event) => setDraft({ ...draft, residue: event.target.value })} />
        <TextField label="ΔΔG‡ from (kJ/mol)" inputMode="decimal" value={draft.ddgMin} onChange={(event) => setDraft({ ...draft, ddgMin: event.target.value })} />
        <TextField label="ΔΔG‡ to (kJ/mol)" inputMode="decimal" value={draft.ddgMax} onChange={(event) => setDraft({ ...draft, ddgMax: event.target.value })} />
      </div>
      <fieldset>
        <legend className="text-sm font-medium text-ink-700">Status</legend>
        <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
          {variantStatuses.map((status) => (
            <label key={status} className="flex items-center gap-1.5 text-sm">
              <input type="checkbox" checked={draft.status.includes(status)} onChange={() => toggleStatus(status)} className="accent-lagoon-700" />
              {status}
            </label>
          ))}
        </div>
      </fieldset>
      {problems.length > 0 && (
        <ul className="text-sm text-signal-danger" aria-label="Filters that were not applied">
          {problems.map((problem) => (
            <li key={problem}>
              <span aria-hidden>⚠ </span>Not applied: {problem}
            </li>
          ))}
        </ul>
      )}
      <div className="flex flex-wrap items-center gap-2">
        <Button type="submit" variant="primary">
          Apply filters
        </Button>
        <Button
          onClick={() => {
            const cleared = toDraft({});
            setDraft(cleared);
            apply(cleared);
          }}
        >
          Clear filters
        </Button>
        <Link to={paths.registry.href(registrySearch)} className="ml-auto text-sm font-medium text-lagoon-700 underline-offset-2 hover:underline">
          Open these variants in the registry
        </Link>
      </div>
    </form>
  );
}
