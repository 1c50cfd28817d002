import { useState, type FormEvent } from 'react';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { CampaignDto } from '@shared/schemas/campaign';
import { catalyticRoles, type CatalyticRole } from '@shared/schemas/enzyme';
import { listVariantsQuery, variantStatuses, type VariantStatus } from '@shared/schemas/variant';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { energyIn } from '@/lib/format';
import { hasFilters, type RegistryFilters } from '../registry-view';
import { statusLabel, type RoleStyles } from './variant-cells';

/** The typed filters, as the reader wrote them (ΔΔG‡ in their unit). */
interface Drafts {
  q: string;
  position: string;
  residue: string;
  minFoldChange: string;
  ddgMin: string;
  ddgMax: string;
}
type DraftField = keyof Drafts;
type DraftErrors = Partial<Record<DraftField, string>>;

// Energies are shown to three decimals: finer than any ΔΔG‡ is known.
const energyText = (kJPerMol: number | undefined, unit: EnergyUnit) =>
  kJPerMol === undefined ? '' : String(Number(energyIn(kJPerMol, unit).toFixed(3)));

function draftsOf(filters: RegistryFilters, unit: EnergyUnit): Drafts {
  return {
    q: filters.q ?? '',
    position: filters.position === undefined ? '' : String(filters.position),
    residue: filters.residue ?? '',
    minFoldChange: filters.minFoldChange === undefined ? '' : String(filters.minFoldChange),
    ddgMin: energyText(filters.ddgMinKJPerMol, unit),
    ddgMax: energyText(filters.ddgMaxKJPerMol, unit),
  };
}

/** One query parameter through the list API's schema: its value, or the schema's message. */
function checkParameter(name: 'q' | 'position' | 'residue' | 'minFoldChange', text: string): { value?: string | number; error?: string } {
  if (text.trim() === '') return {};
  const result = listVariantsQuery.safeParse({ [name]: text });
  if (!result.success) return { error: result.error.issues[0]?.message ?? 'cannot be read' };
  return { value: result.data[name] };
}

const DECIMAL = /^\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?\s*$/;

function readEnergy(text: string, unit: EnergyUnit): { kJPerMol?: number; error?: string } {
  if (text.trim() === '') return {};
  if (!DECIMAL.test(text)) return { error: `must be a number (${unit})` };
  // energyIn converts from kJ/mol; its factor for 1 kJ/mol gives the way back.
  return { kJPerMol: Number(text) / energyIn(1, unit) };
}

/** Reads the drafts into filters, or returns the message for each field that cannot be read. */
function readDrafts(drafts: Drafts, unit: EnergyUnit): { filters: RegistryFilters; errors: DraftErrors } {
  const errors: DraftErrors = {};
  const filters: RegistryFilters = {};
  const q = checkParameter('q', drafts.q);
  if (q.error) errors.q = q.error;
  else if (typeof q.value === 'string') filters.q = q.value;
  const position = checkParameter('position', drafts.position);
  if (position.error) errors.position = position.error;
  else if (typeof position.value === 'number') filters.position = position.value;
  const residue = checkParameter('residue', drafts.residue);
  if (residue.error) errors.residue = residue.error;
  else if (typeof residue.value === 'string') filters.residue = residue.value;
  const fold = checkParameter('minFoldChange', drafts.minFoldChange);
  if (fold.error) errors.minFoldChange = fold.error;
  else if (typeof fold.value === 'number') filters.minFoldChange = fold.value;
  const ddgMin = readEnergy(drafts.ddgMin, unit);
  if (ddgMin.error) errors.ddgMin = ddgMin.error;
  else filters.ddgMinKJPerMol = ddgMin.kJPerMol;
  const ddgMax = readEnergy(drafts.ddgMax, unit);
  if (ddgMax.error) errors.ddgMax = ddgMax.error;
  else filters.ddgMaxKJPerMol = ddgMax.kJPerMol;
  if (filters.ddgMinKJPerMol !== undefined && filters.ddgMaxKJPerMol !== undefined && filters.ddgMinKJPerMol > filters.ddgMaxKJPerMol) {
    errors.ddgMax = 'must not be below the lower bound';
  }
  return { filters, errors };
}

export interface RegistryFilterBarProps {
  filters: RegistryFilters;
  campaigns: readonly CampaignDto[] | undefined;
  /** The campaign list could not be loaded (the other filters still work). */
  campaignsFailed?: boolean;
  energyUnit: EnergyUnit;
  roleStyles: RoleStyles;
  onChange: (filters: RegistryFilters) => void;
}

/**
 * Filters for every field the list API filters on. Choices apply at once; typed values apply on Enter
 * or when the field is left, after the same checks the server makes.
 */
export function RegistryFilterBar({ filters, campaigns, campaignsFailed = false, energyUnit, roleStyles, onChange }: RegistryFilterBarProps) {
  const [drafts, setDrafts] = useState(() => draftsOf(filters, energyUnit));
  const [errors, setErrors] = useState<DraftErrors>({});
  // A new view from the address (a link, back or forward) or a new unit replaces what was typed.
  const sourceKey = `${JSON.stringify(filters)}|${energyUnit}`;
  const [syncedKey, setSyncedKey] = useState(sourceKey);
  if (syncedKey !== sourceKey) {
    setSyncedKey(sourceKey);
    setDrafts(draftsOf(filters, energyUnit));
    setErrors({});
  }

  const chosen = { campaignId: filters.campaignId, role: filters.role, status: filters.status };

  const apply = (next: Partial<RegistryFilters>, nextDrafts = drafts) => {
    const read = readDrafts(nextDrafts, energyUnit);
    setErrors(read.errors);
    if (Object.keys(read.errors).length > 0) return;
    const combined: RegistryFilters = { ...chosen, ...read.filters, ...next };
    if (JSON.stringify(combined) !== JSON.stringify(filters)) onChange(combined);
  };

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    apply({});
  };

  const handleBlur = (field: DraftField) => {
    if (drafts[field] !== draftsOf(filters, energyUnit)[field]) apply({});
  };

  const toggleStatus = (toggled: VariantStatus) => {
    const current = new Set(filters.status ?? []);
    if (current.has(toggled)) current.delete(toggled);
    else current.add(toggled);
    const status = variantStatuses.filter((name) => current.has(name));
    apply({ status: status.length === 0 ? undefined : status });
  };

  const textField = (field: DraftField, label: string, props: { hint?: string; placeholder?: string; inputMode?: 'numeric' | 'decimal' } = {}) => (
    <TextField
      label={label}
      name={field}
      value={drafts[field]}
      error={errors[field]}
      hint={props.hint}
      placeholder={props.placeholder}
      inputMode={props.inputMode}
      autoComplete="off"
      onChange={(event) => setDrafts({ ...drafts, [field]: event.target.value })}
      onBlur={() => handleBlur(field)}
    />
  );

  const campaignOptions = [
    { value: '', label: 'All campaigns' },
    ...(campaigns ?? []).map((campaign) => ({ value: String(campaign.id), label: campaign.name })),
  ];
  if (filters.campaignId !== undefined && !campaignOptions.some((option) => option.value === String(filters.campaignId))) {
    campaignOptions.push({ value: String(filters.campaignId), label: `Campaign ${filters.campaignId}` });
  }

  return (
    <form role="search" aria-label="Filter variants" onSubmit={handleSubmit} className="space-y-4 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
      <div className="grid gap-x-4 gap-y-3 sm:grid-cols-2 lg:grid-cols-[2fr_1.5fr_1.5fr]">
        {textField('q', 'Search', { placeholder: 'Label, HGVS, construct id or notes' })}
        <SelectField
          label="Campaign"
          name="campaignId"
          value={filters.campaignId === undefined ? '' : String(filters.campaignId)}
          options={campaignOptions}
          hint={campaignsFailed ? 'The list of campaigns could not be loaded; reload the page to try again.' : undefined}
          onChange={(event) => apply({ campaignId: event.target.value === '' ? undefined : Number(event.target.value) })}
        />
        <SelectField
          label="Catalytic role at a mutated site"
          name="role"
          value={filters.role ?? ''}
          options={[{ value: '', label: 'Any role' }, ...catalyticRoles.map((role) => ({ value: role, label: roleStyles[role].label }))]}
          onChange={(event) => apply({ role: event.target.value === '' ? undefined : (event.target.value as CatalyticRole) })}
        />
      </div>
      <div className="grid gap-x-4 gap-y-3 sm:grid-cols-3 lg:grid-cols-5">
        {textField('position', 'Position', { inputMode: 'numeric', placeholder: 'e.g. 190' })}
        {textField('residue', 'Residue (from or to)', { placeholder: 'e.g. H or His' })}
        {textField('minFoldChange', 'Fold change at least (×)', { inputMode: 'decimal', placeholder: 'e.g. 1.5' })}
        {textField('ddgMin', `ΔΔG‡ from (${energyUnit})`, { inputMode: 'decimal' })}
        {textField('ddgMax', `ΔΔG‡ to (${energyUnit})`, { inputMode: 'decimal', hint: 'Negative is better than the parent.' })}
      </div>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <fieldset>
          <legend className="mb-1 text-sm font-medium text-ink-700">Status</legend>
          <div className="flex flex-wrap gap-1.5">
            {variantStatuses.map((status) => {
              const checked = filters.status?.includes(status) ?? false;
              return (
                <label
                  key={status}
                  className={`inline-flex cursor-pointer items-center gap-1.5 rounded-full border px-3 py-1 text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ember-500 ${checked ? 'border-lagoon-700 bg-lagoon-700 text-white' : 'border-paper-300 bg-white text-ink-700 hover:bg-paper-100'}`}
                >
                  <input type="checkbox" className="sr-only" checked={checked} onChange={() => toggleStatus(status)} />
                  <span aria-hidden>{checked ? '✓' : '+'}</span>
                  {statusLabel(status)}
                </label>
              );
            })}
          </div>
        </fieldset>
        <div className="flex gap-2">
          {/* Enter in a field submits; the button is there for those who look for one. */}
          <Button type="submit" variant="secondary">
            Apply
          </Button>
          <Button variant="quiet" disabled={!hasFilters(filters)} onClick={() => onChange({})}>
            Clear filters
          </Button>
        </div>
      </div>
    </form>
  );
}
