import { useDeferredValue, useEffect, useMemo, useState, type ReactNode } from 'react';
import { useForm, useWatch, type Path } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { phRateKindOfUnit } from '@shared/imports/unit-spelling';
import type { FitResult } from '@shared/kinetics/types';
import { rateUnits } from '@shared/schemas/assay';
import { createPhProfileInput, phModels, type PhModelName, type PhProfileDto, type PhRateKindName } from '@shared/schemas/ph-profile';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { formatNumber } from '@/lib/format';
import { useCreatePhProfile } from '../api/create-ph-profile';
import { useEnzymeSites } from '../api/get-enzyme-sites';
import { useVariant } from '../api/get-variant';
import { parsePastedBlock, phBlock, type ParsedBlock } from '../lib/parse-pasted-block';
import { phModelNames, phPreview, pkaCandidates, type FittedPka, type PhPreview } from '../lib/ph-preview';
import { emptyGrid, gridFromBlock, gridPoints, setExclusion } from '../lib/point-grid';
import { LiveFitBoundary } from './live-fit-boundary';
import { ParameterTable } from './parameter-table';
import { PasteBlock } from './paste-block';
import { PointGridEditor } from './point-grid-editor';
import { VariantPicker } from './variant-picker';

/** What the page's chart needs from the live fit. */
export interface PhChartInput {
  points: { key: string; ph: number; k: number; excluded: boolean }[];
  fit: FitResult | null;
  curveLabel: string;
  rateTitle: string;
  pkas: { label: string; value: number; se: number | null }[];
  optimum: { label: string; value: number; se: number | null } | null;
  onPointClick: (key: string) => void;
}

interface PhValues {
  variantId: string;
  substrate: string;
  temperatureC: string;
  rateKind: PhRateKindName;
  unit: string;
  model: PhModelName;
}

const kindLabels: Record<PhRateKindName, string> = { kcat: 'kcat', kcatOverKm: 'kcat/Km', v0: 'v₀' };
// One spelling per unit in the pickers; the canonical ones are what a pasted header turns into.
const unitChoices: Record<PhRateKindName, { value: string; label: string }[]> = {
  kcat: [
    { value: '1/s', label: 's⁻¹' },
    { value: '1/min', label: 'min⁻¹' },
  ],
  kcatOverKm: ['M', 'mM', 'µM'].flatMap((concentration) => ['s', 'min'].map((time) => ({ value: `${concentration}⁻¹ ${time}⁻¹`, label: `${concentration}⁻¹ ${time}⁻¹` }))),
  v0: rateUnits.filter((unit) => !unit.startsWith('uM') && !unit.startsWith('μM')).map((unit) => ({ value: unit, label: unit })),
};
const unitLabel = (kind: PhRateKindName, unit: string) => unitChoices[kind].find((choice) => choice.value === unit)?.label ?? unit;

const pkaSe = (pka: FittedPka) => (Number.isFinite(pka.estimate.se) ? pka.estimate.se : null);

/**
 * pH profile entry: a rate (kcat, kcat/Km or v₀) against pH in the same grid as assay entry, fitted live
 * with the bell-shaped or a single-limb model, with the pKa values, the pH optimum and the annotated
 * residues that might own each pKa; saved through POST /api/ph-profiles, whose own fit is shown beside.
 */
export function PhProfileWorkspace({ initialVariantId, renderChart }: { initialVariantId: number | null; renderChart: (input: PhChartInput) => ReactNode }) {
  const form = useForm<PhValues>({
    defaultValues: { variantId: initialVariantId === null ? '' : String(initialVariantId), substrate: '', temperatureC: '', rateKind: 'kcatOverKm', unit: 'M⁻¹ s⁻¹', model: 'bell' },
  });
  const { errors } = form.formState;
  const [campaignId, setCampaignId] = useState<number | null>(null);
  const [grid, setGrid] = useState(() => emptyGrid(10, 1));
  const [pasteText, setPasteText] = useState('');
  const [pasteReport, setPasteReport] = useState<Pick<ParsedBlock, 'notes' | 'problems'> | null>(null);
  const [saved, setSaved] = useState<{ profile: PhProfileDto; preview: PhPreview } | null>(null);
  const [otherProblems, setOtherProblems] = useState<string[]>([]);
  const createProfile = useCreatePhProfile();

  const [variantId, rateKind, unit, model] = useWatch({ control: form.control, name: ['variantId', 'rateKind', 'unit', 'model'] });
  const variant = useVariant(variantId === '' ? null : Number(variantId));
  const sites = useEnzymeSites(variant.data?.enzymeId ?? null);
  const initialVariant = useVariant(initialVariantId);
  useEffect(() => {
    if (initialVariant.data) setCampaignId((current) => current ?? initialVariant.data.campaignId);
  }, [initialVariant.data]);
  useEffect(() => {
    // A campaign's target substrate and temperature are the usual conditions of its pH series.
    const target = variant.data?.campaign;
    if (!target) return;
    if (form.getValues('substrate') === '') form.setValue('substrate', target.targetSubstrate);
    if (form.getValues('temperatureC') === '') form.setValue('temperatureC', String(target.targetTemperatureC));
  }, [variant.data, form]);

  const deferredGrid = useDeferredValue(grid);
  const live = useMemo(() => {
    const { points, problems } = gridPoints(deferredGrid, { x: 'pH', y: 'the rate', xMax: 14 });
    // A failure inside the fit must not take the typed points with it; it is shown instead of the fit.
    try {
      return { points, problems, preview: points.length > 0 ? phPreview(points, model) : null, failure: null };
    } catch (error) {
      return { points, problems, preview: null, failure: error instanceof Error ? error.message : String(error) };
    }
  }, [deferredGrid, model]);
  const candidates = useMemo(() => (live.preview && sites.data ? pkaCandidates(live.preview.pkas, sites.data.rows) : null), [live.preview, sites.data]);

  const rateTitle = `${kindLabels[rateKind]} (${unitLabel(rateKind, unit)})`;

  const handleBlock = (block: ParsedBlock) => {
    if (block.yUnit) {
      const kind = phRateKindOfUnit(block.yUnit);
      form.setValue('rateKind', kind);
      form.setValue('unit', block.yUnit);
    }
    setPasteReport({
      notes: [`Read ${block.rows.length} pH values${block.replicateCount > 1 ? ` with ${block.replicateCount} replicate columns` : ''}.`, ...(block.yUnit ? [`Unit from the header: ${unitLabel(phRateKindOfUnit(block.yUnit), block.yUnit)}.`] : []), ...block.notes],
      problems: block.problems,
    });
  };
  const handlePasteArea = (text: string) => {
    const block = parsePastedBlock(text, phBlock);
    if (block.rows.length > 0) setGrid(gridFromBlock(block));
    handleBlock(block);
    setPasteText('');
  };
  const handleToggleExclusion = (key: string) => setGrid(setExclusion(grid, key, grid.exclusions[key] === undefined ? '' : null));

  const handleSave = form.handleSubmit(async (values) => {
    form.clearErrors();
    setOtherProblems([]);
    const current = gridPoints(grid, { x: 'pH', y: 'the rate', xMax: 14 });
    if (current.problems.length > 0) {
      setOtherProblems(['Some cells of the grid cannot be used; correct them or clear them first.']);
      return;
    }
    const preview = phPreview(current.points, values.model);
    const body = {
      variantId: values.variantId === '' ? undefined : Number(values.variantId),
      substrate: values.substrate,
      temperatureC: values.temperatureC.trim() === '' ? undefined : Number(values.temperatureC.replace(',', '.')),
      rateKind: values.rateKind,
      unit: values.unit,
      model: values.model,
      points: preview.requestPoints,
    };
    const parsed = createPhProfileInput.safeParse(body);
    if (!parsed.success) {
      const other: string[] = [];
      for (const issue of parsed.error.issues) {
        const field = String(issue.path[0] ?? '');
        if (['variantId', 'substrate', 'temperatureC', 'unit'].includes(field)) form.setError(field as Path<PhValues>, { message: String(values[field as keyof PhValues]).trim() === '' ? 'is required' : issue.message });
        else other.push(`${field === 'points' ? 'pH points' : field}: ${issue.message}.`);
      }
      setOtherProblems(other);
      return;
    }
    if (preview.error) {
      setOtherProblems([`The points cannot be fitted: ${preview.error}.`]);
      return;
    }
    try {
      const profile = await createProfile.mutateAsync(parsed.data);
      setSaved({ profile, preview });
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) {
          if (['variantId', 'substrate', 'temperatureC', 'unit'].includes(field)) form.setError(field as Path<PhValues>, { message });
        }
        setOtherProblems([error.message]);
      } else {
        setOtherProblems(['The server could not be reached. Check your connection and try again.']);
      }
    }
  });

  // Stable between renders that do not change the fit, so the chart is not rebuilt for nothing.
  const chartInput = useMemo(() => {
    const optimum = live.preview?.optimum;
    return {
      points: live.points.map((point) => ({ key: point.key, ph: point.x, k: point.y, excluded: point.excluded })),
      fit: live.preview && !live.preview.error ? live.preview.fit : null,
      pkas: (live.preview?.pkas ?? []).map((pka) => ({ label: pka.parameter, value: pka.estimate.value, se: pkaSe(pka) })),
      optimum: optimum ? { label: 'pH optimum', value: optimum.value, se: Number.isFinite(optimum.se) ? optimum.se : null } : null,
    };
  }, [live]);

  return (
    <form noValidate onSubmit={handleSave} className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <fieldset disabled={saved !== null} className="min-w-0 space-y-6">
        <section aria-labelledby="ph-variant-title" className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <h2 id="ph-variant-title" className="text-base font-semibold">
            Variant and conditions
          </h2>
          <VariantPicker campaignId={campaignId} onCampaignChange={setCampaignId} variantId={variantId} onVariantChange={(id) => form.setValue('variantId', id)} error={errors.variantId?.message} />
          <div className="grid gap-3 sm:grid-cols-3">
            <div className="sm:col-span-2">
              <TextField label="Substrate" autoComplete="off" error={errors.substrate?.message} {...form.register('substrate')} />
            </div>
            <TextField label="Temperature (°C)" inputMode="decimal" error={errors.temperatureC?.message} {...form.register('temperatureC')} />
            <SelectField
              label="Rate measured"
              options={[
                { value: 'kcatOverKm', label: 'kcat/Km' },
                { value: 'kcat', label: 'kcat' },
                { value: 'v0', label: 'v₀ at one [S]' },
              ]}
              {...form.register('rateKind', { onChange: (event) => form.setValue('unit', unitChoices[event.target.value as PhRateKindName][0].value) })}
            />
            <SelectField label="Rate unit" options={unitChoices[rateKind]} error={errors.unit?.message} {...form.register('unit')} />
          </div>
        </section>

        <section aria-labelledby="ph-points-title" className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <div>
            <h2 id="ph-points-title" className="text-base font-semibold">
              pH series
            </h2>
            <p className="text-sm text-ink-500">One row per pH; replicate columns become more points at the same pH. A header such as “pH” and “kcat/Km (M-1 s-1)” sets the rate and its unit.</p>
          </div>
          <PasteBlock id="ph-paste" placeholder={'pH\tkcat/Km (M-1 s-1)\n4.0\t1200'} text={pasteText} onTextChange={setPasteText} onRead={handlePasteArea} report={pasteReport} />
          <PointGridEditor
            state={grid}
            onChange={setGrid}
            xTitle="pH"
            yTitle={rateTitle}
            problems={live.problems}
            parse={(text) => parsePastedBlock(text, phBlock)}
            onBlockPasted={handleBlock}
            onToggleExclusion={handleToggleExclusion}
          />
        </section>

        <div className="space-y-3">
          {otherProblems.length > 0 && (
            <Notice tone="danger" title="The pH profile was not saved">
              <ul className="list-disc pl-4">
                {otherProblems.map((problem) => (
                  <li key={problem}>{problem}</li>
                ))}
              </ul>
            </Notice>
          )}
          <Button type="submit" variant="primary" busy={createProfile.isPending}>
            Save pH profile
          </Button>
        </div>
      </fieldset>

      <div className="min-w-0 space-y-4 lg:sticky lg:top-4 lg:self-start">
        {saved && <SavedProfile saved={saved} onNext={() => { setSaved(null); setGrid(emptyGrid(10, 1)); createProfile.reset(); }} />}
        <section aria-labelledby="ph-fit-title" className="space-y-4 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <div>
            <h2 id="ph-fit-title" className="text-base font-semibold">
              Live fit
            </h2>
            <p className="text-sm text-ink-500">Recomputed in this browser as you type. Click a point (or ⊘ in the grid) to leave it out.</p>
          </div>
          <fieldset>
            <legend className="text-sm font-medium text-ink-700">Model</legend>
            <div className="mt-1 flex flex-wrap gap-2">
              {phModels.map((name) => (
                <label key={name} className={`flex cursor-pointer items-center gap-2 rounded-md border px-3 py-1.5 text-sm ${name === model ? 'border-lagoon-500 bg-lagoon-50 font-semibold text-lagoon-900' : 'border-paper-300 bg-white'}`}>
                  <input type="radio" value={name} className="accent-lagoon-700" {...form.register('model')} />
                  {phModelNames[name]}
                </label>
              ))}
            </div>
          </fieldset>
          {live.preview ? (
            <LiveFitBoundary resetKey={JSON.stringify([live.preview.requestPoints, model, rateKind, unit])}>
              {renderChart({
                ...chartInput,
                curveLabel: `${model === 'bell' ? 'Bell-shaped' : model === 'acid' ? 'Acid-limb' : 'Base-limb'} fit`,
                rateTitle,
                onPointClick: handleToggleExclusion,
              })}
              <PhFitResults preview={live.preview} unitText={unitLabel(rateKind, unit)} candidates={candidates} sitesLoading={variant.data !== undefined && sites.isPending} />
            </LiveFitBoundary>
          ) : live.failure ? (
            <Notice tone="danger" title="The live fit failed for these points.">
              {live.failure}. Your points are kept; change them or the model to try again.
            </Notice>
          ) : (
            <p className="rounded-md border border-dashed border-paper-300 px-4 py-8 text-center text-sm text-ink-500">No points yet. Paste or type rates at four or more pH values.</p>
          )}
        </section>
      </div>
    </form>
  );
}

function PhFitResults({ preview, unitText, candidates, sitesLoading }: { preview: PhPreview; unitText: string; candidates: ReturnType<typeof pkaCandidates> | null; sitesLoading: boolean }) {
  if (preview.error || !preview.fit) {
    return (
      <Notice tone="caution" title="No fit yet">
        {preview.error ? `${preview.error[0].toUpperCase()}${preview.error.slice(1)}.` : null}
      </Notice>
    );
  }
  const kmax = preview.fit.parameters.kmax;
  const rows = [
    ...preview.pkas.map((pka) => ({ name: pka.parameter, estimate: pka.estimate, unit: '', digits: 2 })),
    ...(preview.optimum ? [{ name: 'pH optimum', estimate: preview.optimum, unit: '', digits: 2 }] : []),
    { name: 'kmax', estimate: kmax, unit: unitText, digits: 0 },
  ];
  return (
    <div className="space-y-4">
      <ParameterTable
        label="Fitted pH parameters"
        rows={rows.map((row) => ({
          name: row.name,
          storedValue: row.estimate.value,
          value: row.digits > 0 ? row.estimate.value.toFixed(row.digits) : formatNumber(row.estimate.value, 4),
          se: Number.isFinite(row.estimate.se) ? (row.digits > 0 ? row.estimate.se.toFixed(row.digits) : formatNumber(row.estimate.se, 2)) : '—',
          ci95: Number.isFinite(row.estimate.ci95[0]) ? `${formatNumber(row.estimate.ci95[0], 3)} – ${formatNumber(row.estimate.ci95[1], 3)}` : 'unbounded',
          unit: row.unit,
        }))}
      />
      <p className="text-xs text-ink-500">
        {preview.fit.n} points, {preview.fit.df} degrees of freedom. Fitted in this browser in {preview.elapsedMs.toFixed(1)} ms.
      </p>
      {preview.fit.warnings.map((warning) => (
        <Notice key={warning} tone="caution" title="Fit warning">
          {warning[0].toUpperCase() + warning.slice(1)}.
        </Notice>
      ))}
      <section aria-labelledby="candidates-title" className="space-y-2">
        <h3 id="candidates-title" className="text-sm font-semibold">
          Annotated residues that might own each pKa
        </h3>
        <p className="text-xs text-ink-500">Ionizable catalytic residues of the parent, nearest free side-chain pKa first (Dawson et al. 1986). The profile says that a group ionizes, not which; the assignment is yours.</p>
        {sitesLoading && <p className="text-sm text-ink-500">Loading the enzyme’s annotated sites…</p>}
        {candidates === null && !sitesLoading && <p className="text-sm text-ink-500">Choose a variant to compare with its enzyme’s annotated residues.</p>}
        {candidates !== null && (
          <table className="w-full text-sm" aria-label="Candidate residues">
            <thead className="text-left text-xs text-ink-500">
              <tr className="border-b border-paper-200">
                <th scope="col" className="py-1 pr-2 font-medium">Fitted</th>
                <th scope="col" className="py-1 pr-2 font-medium">Residue</th>
                <th scope="col" className="py-1 pr-2 font-medium">Role</th>
                <th scope="col" className="py-1 pr-2 text-right font-medium">Free pKa</th>
                <th scope="col" className="py-1 pr-2 text-right font-medium">Shift</th>
                <th scope="col" className="py-1 text-right font-medium">Expected here</th>
              </tr>
            </thead>
            <tbody>
              {preview.pkas.map((pka, index) =>
                candidates[index].length === 0 ? (
                  <tr key={pka.parameter} className="border-b border-paper-100">
                    <th scope="row" className="py-1 pr-2 text-left font-medium">{pka.parameter} {pka.estimate.value.toFixed(2)}</th>
                    <td colSpan={5} className="py-1 text-ink-500">No ionizable residue is annotated on this enzyme.</td>
                  </tr>
                ) : (
                  candidates[index].slice(0, 3).map((candidate, rank) => (
                    <tr key={`${pka.parameter}-${candidate.position}`} className="border-b border-paper-100">
                      <th scope="row" className="py-1 pr-2 text-left font-medium">{rank === 0 ? `${pka.parameter} ${pka.estimate.value.toFixed(2)}` : <span className="sr-only">{pka.parameter}</span>}</th>
                      <td className="py-1 pr-2 font-mono">{`${candidate.residue}${candidate.position}`}</td>
                      <td className="py-1 pr-2">{candidate.roles.join(', ')}</td>
                      <td className="numeric py-1 pr-2 font-mono">{candidate.freePka.toFixed(2)}</td>
                      <td className="numeric py-1 pr-2 font-mono">{`${candidate.shift >= 0 ? '+' : '−'}${Math.abs(candidate.shift).toFixed(2)}`}</td>
                      <td className="numeric py-1 font-mono">{candidate.expectedPka === null ? '—' : candidate.expectedPka.toFixed(1)}</td>
                    </tr>
                  ))
                ),
              )}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}

function SavedProfile({ saved, onNext }: { saved: { profile: PhProfileDto; preview: PhPreview }; onNext: () => void }) {
  const { profile, preview } = saved;
  const pairs = [
    ...preview.pkas.map((pka) => ({ name: pka.parameter, preview: pka.estimate.value, server: (pka.parameter === 'pKa1' ? profile.pKa1 : profile.pKa2)?.value ?? null })),
    ...(preview.optimum ? [{ name: 'pH optimum', preview: preview.optimum.value, server: profile.phOptimum?.value ?? null }] : []),
  ];
  const agree = pairs.every((pair) => pair.server !== null && Math.abs(pair.preview - pair.server) <= 1e-9 * Math.max(1, Math.abs(pair.server)));
  return (
    <section aria-labelledby="ph-saved-title" className="space-y-3 rounded-lg border border-signal-fine bg-white p-4 shadow-card">
      <h2 id="ph-saved-title" className="sr-only">
        Saved pH profile
      </h2>
      <Notice tone={agree ? 'fine' : 'danger'} title={`Saved: pH profile ${profile.id} of ${profile.variant.label}. ${agree ? "The server's fit agrees with the preview." : "The server's fit differs from the preview."}`} />
      <table className="w-full text-sm" aria-label="Preview and stored pH values">
        <thead className="text-left text-xs text-ink-500">
          <tr className="border-b border-paper-200">
            <th scope="col" className="py-1 pr-2 font-medium">Parameter</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Preview</th>
            <th scope="col" className="py-1 text-right font-medium">Stored by the server</th>
          </tr>
        </thead>
        <tbody>
          {pairs.map((pair) => (
            <tr key={pair.name} className="border-b border-paper-100">
              <th scope="row" className="py-1 pr-2 text-left font-medium">{pair.name}</th>
              <td className="numeric py-1 pr-2 font-mono" data-preview={pair.name} data-value={pair.preview}>
                {pair.preview.toFixed(4)}
              </td>
              <td className="numeric py-1 font-mono" data-stored={pair.name} data-value={pair.server ?? ''}>
                {pair.server === null ? '—' : pair.server.toFixed(4)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex flex-wrap gap-2">
        <Link to={paths.variant.href(profile.variant.id)} className="inline-flex items-center rounded-md border border-paper-300 bg-white px-3.5 py-2 text-sm font-semibold text-ink-900 hover:bg-paper-100">
          Open {profile.variant.label}
        </Link>
        <Button variant="primary" onClick={onNext}>
          Enter another pH profile
        </Button>
      </div>
    </section>
  );
}
