import { useDeferredValue, useEffect, useMemo, useState, type ReactNode } from 'react';
import { useForm, useWatch, type Path } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { AssayFit } from '@shared/assay/fit-assay';
import type { FitResult } from '@shared/kinetics/types';
import type { AssayDto, ConcentrationUnitInput, RateUnitInput } from '@shared/schemas/assay';
import { maxAttachmentsPerUpload } from '@shared/schemas/attachment';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { useCreateAssay } from '../api/create-assay';
import { useVariant } from '../api/get-variant';
import { useUploadAssayFiles } from '../api/upload-assay-files';
import { assayBody, blankConditions, checkAssayBody, concentrationUnitChoices, rateUnitChoices, sortFieldMessages, type AssayConditionsValues } from '../lib/assay-form';
import { assayPreview, modelNames } from '../lib/assay-preview';
import { parsePastedBlock, rateBlock, type ParsedBlock } from '../lib/parse-pasted-block';
import { emptyGrid, gridFromBlock, gridPoints, setExclusion, type GridPoint } from '../lib/point-grid';
import { loadRememberedConditions, rememberConditions } from '../lib/remembered-conditions';
import { AssayFitSummary } from './assay-fit-summary';
import { ConditionsFields } from './conditions-fields';
import { ExcludePointDialog } from './exclude-point-dialog';
import { FilePicker, fileProblem, formatBytes } from './file-picker';
import { LiveFitBoundary } from './live-fit-boundary';
import { PasteBlock } from './paste-block';
import { PointGridEditor } from './point-grid-editor';
import { SaveAgreement } from './save-agreement';
import { VariantPicker } from './variant-picker';

/** What the page's charts need from the live fit (the route draws them with the charts feature). */
export interface AssayChartsInput {
  points: { key: string; s: number; v: number; replicate: number; excluded: boolean; reason: string | null }[];
  fit: FitResult | null;
  curveLabel: string;
  sUnit: string;
  vUnit: string;
  onPointClick: (key: string) => void;
}

export interface AssayEntryWorkspaceProps {
  userId: number;
  initialVariantId: number | null;
  renderCharts: (input: AssayChartsInput) => ReactNode;
}

interface SavedAssay {
  assay: AssayDto;
  measurement: MeasurementDto;
  preview: AssayFit;
}

const sUnitOptions = concentrationUnitChoices.map((unit) => ({ value: unit, label: unit }));
const vUnitOptions = rateUnitChoices.map((unit) => ({ value: unit, label: unit }));

/** Describes a point for the exclusion dialog. */
function describePoint(point: GridPoint, sUnit: string, vUnit: string): string {
  return `Row ${point.row + 1}, replicate ${point.replicate}: [S] ${point.x} ${sUnit}, v₀ ${point.y} ${vUnit}`;
}

/**
 * Assay entry: variant and conditions, the rate-point grid (typed or pasted), the live fit in the browser,
 * exclusions with reasons, saving (the server refits and its numbers are shown beside the preview's) and
 * the raw instrument files.
 */
export function AssayEntryWorkspace({ userId, initialVariantId, renderCharts }: AssayEntryWorkspaceProps) {
  const form = useForm<AssayConditionsValues>({
    defaultValues: { ...blankConditions(), ...loadRememberedConditions(userId), variantId: initialVariantId === null ? '' : String(initialVariantId) },
  });
  const { errors } = form.formState;
  const [campaignId, setCampaignId] = useState<number | null>(null);
  const initialVariant = useVariant(initialVariantId);
  useEffect(() => {
    if (initialVariant.data) setCampaignId((current) => current ?? initialVariant.data.campaignId);
  }, [initialVariant.data]);

  const [grid, setGrid] = useState(() => emptyGrid(8, 1));
  const [pasteText, setPasteText] = useState('');
  const [pasteReport, setPasteReport] = useState<Pick<ParsedBlock, 'notes' | 'problems'> | null>(null);
  const [excluding, setExcluding] = useState<string | null>(null);
  const [files, setFiles] = useState<File[]>([]);
  const [saved, setSaved] = useState<SavedAssay | null>(null);
  const [otherProblems, setOtherProblems] = useState<string[]>([]);
  const createAssay = useCreateAssay();
  const uploadFiles = useUploadAssayFiles();

  const [sUnit, vUnit, enzymeValue, enzymeUnit, model, variantId] = useWatch({
    control: form.control,
    name: ['sUnit', 'vUnit', 'enzymeValue', 'enzymeUnit', 'model', 'variantId'],
  });
  const deferredGrid = useDeferredValue(grid);
  const enzymeConcentration = useMemo(() => {
    const value = Number(enzymeValue.trim().replace(',', '.'));
    return enzymeValue.trim() !== '' && Number.isFinite(value) && value > 0 ? { value, unit: enzymeUnit } : null;
  }, [enzymeValue, enzymeUnit]);
  const live = useMemo(() => {
    const { points, problems } = gridPoints(deferredGrid, { x: '[S]', y: 'v₀' });
    // A failure inside the fit must not take the typed points with it; it is shown instead of the fit.
    try {
      return { points, problems, preview: points.length > 0 ? assayPreview(points, { sUnit, vUnit, enzymeConcentration, model }) : null, failure: null };
    } catch (error) {
      return { points, problems, preview: null, failure: error instanceof Error ? error.message : String(error) };
    }
  }, [deferredGrid, sUnit, vUnit, enzymeConcentration, model]);

  const pointsByKey = new Map(live.points.map((point) => [point.key, point]));
  const excludingPoint = excluding === null ? undefined : pointsByKey.get(excluding);

  const handleToggleExclusion = (key: string) => {
    if (grid.exclusions[key] !== undefined) setGrid(setExclusion(grid, key, null));
    else if (pointsByKey.has(key)) setExcluding(key);
  };

  const handleBlock = (block: ParsedBlock) => {
    if (block.xUnit) form.setValue('sUnit', block.xUnit as ConcentrationUnitInput);
    if (block.yUnit) form.setValue('vUnit', block.yUnit as RateUnitInput);
    const units = [block.xUnit && `[S] in ${block.xUnit}`, block.yUnit && `v₀ in ${block.yUnit}`].filter(Boolean).join(', ');
    setPasteReport({
      notes: [`Read ${block.rows.length} rows with ${block.replicateCount} replicate column${block.replicateCount === 1 ? '' : 's'}.`, ...(units ? [`Units from the header: ${units}.`] : []), ...block.notes],
      problems: block.problems,
    });
  };

  const handlePasteArea = (text: string) => {
    const block = parsePastedBlock(text, rateBlock);
    if (block.rows.length > 0) setGrid(gridFromBlock(block));
    handleBlock(block);
    setPasteText('');
  };

  const handleSave = form.handleSubmit(async (values) => {
    form.clearErrors();
    setOtherProblems([]);
    // The grid as it is now, not the deferred copy, so that what is saved is exactly what is compared.
    const current = gridPoints(grid, { x: '[S]', y: 'v₀' });
    if (current.problems.length > 0) {
      setOtherProblems(['Some cells of the grid cannot be used; correct them or clear them first.']);
      return;
    }
    const preview = assayPreview(current.points, { sUnit: values.sUnit, vUnit: values.vUnit, enzymeConcentration, model: values.model });
    const checked = checkAssayBody(assayBody(values, preview.requestPoints));
    if (!checked.ok) {
      const { byField, other } = sortFieldMessages(checked.fields, values);
      for (const [field, message] of Object.entries(byField)) form.setError(field as Path<AssayConditionsValues>, { message });
      setOtherProblems(other);
      return;
    }
    if (preview.chosen.error || !preview.chosen.fit) {
      setOtherProblems([`The points cannot be fitted with the ${modelNames[values.model]} model: ${preview.chosen.error ?? 'no fit'}.`]);
      return;
    }
    const previewFit = preview.chosen.fit;
    try {
      const result = await createAssay.mutateAsync(checked.input);
      rememberConditions(userId, values);
      setSaved({ ...result, preview: previewFit });
      const uploadable = files.filter((file) => fileProblem(file) === null).slice(0, maxAttachmentsPerUpload);
      if (uploadable.length > 0) uploadFiles.mutate({ assayId: result.assay.id, files: uploadable });
    } catch (error) {
      if (error instanceof ApiError && Object.keys(error.fields).length > 0) {
        const { byField, other } = sortFieldMessages(error.fields, values);
        for (const [field, message] of Object.entries(byField)) form.setError(field as Path<AssayConditionsValues>, { message });
        setOtherProblems(other.length > 0 ? other : [error.message]);
      } else {
        setOtherProblems([error instanceof Error ? error.message : 'The server could not be reached. Check your connection and try again.']);
      }
    }
  });

  const handleNext = () => {
    setSaved(null);
    setGrid(emptyGrid(8, 1));
    setFiles([]);
    setPasteReport(null);
    setPasteText('');
    uploadFiles.reset();
    createAssay.reset();
    form.reset({ ...form.getValues(), notes: '' });
  };

  const fileProblems = files.map(fileProblem).filter((problem) => problem !== null);
  // Stable between renders that do not change the points, so the charts are not rebuilt for nothing.
  const chartPoints = useMemo(
    () => live.points.map((point) => ({ key: point.key, s: point.x, v: point.y, replicate: point.replicate, excluded: point.excluded, reason: point.reason })),
    [live.points],
  );
  const chosenFit = live.preview?.chosen.error ? null : (live.preview?.chosen.fit?.fit ?? null);

  return (
    <>
    <form noValidate onSubmit={handleSave} className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <fieldset disabled={saved !== null} className="min-w-0 space-y-6">
        <section aria-labelledby="variant-title" className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <h2 id="variant-title" className="text-base font-semibold">
            Variant
          </h2>
          <VariantPicker
            campaignId={campaignId}
            onCampaignChange={setCampaignId}
            variantId={variantId}
            onVariantChange={(id) => form.setValue('variantId', id, { shouldValidate: false })}
            error={errors.variantId?.message}
          />
        </section>

        <section aria-labelledby="conditions-title" className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <div>
            <h2 id="conditions-title" className="text-base font-semibold">
              Conditions
            </h2>
            <p className="text-sm text-ink-500">Filled in from your last saved assay; change what differs.</p>
          </div>
          <ConditionsFields register={form.register} errors={errors} />
        </section>

        <section aria-labelledby="points-title" className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <div>
            <h2 id="points-title" className="text-base font-semibold">
              Rate points
            </h2>
            <p className="text-sm text-ink-500">
              Type, or paste a block from a spreadsheet into the first cell or the box below: one row per substrate concentration, one column per replicate. A header such as “[S] (mM)” and “v0 (µM/min)” sets the units.
            </p>
          </div>
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField label="[S] unit" options={sUnitOptions} error={errors.sUnit?.message} {...form.register('sUnit')} />
            <SelectField label="v₀ unit" options={vUnitOptions} error={errors.vUnit?.message} {...form.register('vUnit')} />
          </div>
          <PasteBlock id="rate-paste" placeholder={'[S] (mM)\tv0 (µM/min)\n0.05\t12.1'} text={pasteText} onTextChange={setPasteText} onRead={handlePasteArea} report={pasteReport} />
          <PointGridEditor
            state={grid}
            onChange={setGrid}
            xTitle={`[S] (${sUnit})`}
            yTitle={`v₀ (${vUnit})`}
            problems={live.problems}
            parse={(text) => parsePastedBlock(text, rateBlock)}
            onBlockPasted={handleBlock}
            onToggleExclusion={handleToggleExclusion}
          />
          {Object.keys(grid.exclusions).length > 0 && (
            <div className="text-sm">
              <h3 className="font-medium text-ink-700">Excluded points</h3>
              <ul className="mt-1 space-y-1">
                {live.points
                  .filter((point) => point.excluded)
                  .map((point) => (
                    <li key={point.key} className="flex flex-wrap items-center justify-between gap-2 rounded border border-paper-200 px-2 py-1">
                      <span>
                        <span className="font-mono text-xs">{describePoint(point, sUnit, vUnit)}</span>
                        <span className="block text-xs text-ink-500">{point.reason}</span>
                      </span>
                      <Button variant="quiet" className="px-2 py-0.5 text-xs" onClick={() => setGrid(setExclusion(grid, point.key, null))}>
                        Include again
                      </Button>
                    </li>
                  ))}
              </ul>
            </div>
          )}
        </section>

        <section aria-labelledby="files-title" className="space-y-3 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <h2 id="files-title" className="text-base font-semibold">
            Raw files
          </h2>
          <FilePicker files={files} onChange={setFiles} />
        </section>

        <div className="space-y-3">
          {otherProblems.length > 0 && (
            <Notice tone="danger" title="The assay was not saved">
              <ul className="list-disc pl-4">
                {otherProblems.map((problem) => (
                  <li key={problem}>{problem}</li>
                ))}
              </ul>
            </Notice>
          )}
          {Object.keys(errors).length > 0 && otherProblems.length === 0 && <Notice tone="danger" title="Some fields need attention; see the messages beside them." />}
          <Button type="submit" variant="primary" busy={createAssay.isPending} disabled={fileProblems.length > 0}>
            Save assay and measurement
          </Button>
        </div>
      </fieldset>

      <div className="min-w-0 space-y-4 lg:sticky lg:top-4 lg:self-start">
        {saved && (
          <section aria-labelledby="saved-title" className="space-y-3 rounded-lg border border-signal-fine bg-white p-4 shadow-card">
            <Notice tone="fine" title={`Saved: assay ${saved.assay.id} of ${saved.assay.variant.label} with a draft measurement.`} />
            <h2 id="saved-title" className="sr-only">
              Saved assay
            </h2>
            <SaveAgreement preview={saved.preview} measurement={saved.measurement} />
            {uploadFiles.isPending && <p className="text-sm text-ink-500">Uploading the raw files…</p>}
            {uploadFiles.isError && (
              <Notice tone="danger" title="The raw files were not attached">
                {uploadFiles.error.message}{' '}
                <Button variant="quiet" className="px-2 py-0.5 text-xs" onClick={() => uploadFiles.mutate({ assayId: saved.assay.id, files: files.slice(0, maxAttachmentsPerUpload) })}>
                  Try again
                </Button>
              </Notice>
            )}
            {uploadFiles.data && (
              <div className="text-sm">
                <h3 className="font-medium">Attached files</h3>
                <ul className="mt-1 space-y-1">
                  {uploadFiles.data.map((attachment) => (
                    <li key={attachment.id} className="flex flex-wrap justify-between gap-2">
                      <a href={attachment.contentUrl} className="font-mono text-xs text-lagoon-700 underline">
                        {attachment.originalName}
                      </a>
                      <span className="font-mono text-xs text-ink-500" title={`SHA-256 ${attachment.sha256}`}>
                        {formatBytes(attachment.sizeBytes)} · SHA-256 {attachment.sha256.slice(0, 12)}…
                      </span>
                    </li>
                  ))}
                </ul>
              </div>
            )}
            <div className="flex flex-wrap gap-2">
              <Link to={paths.variant.href(saved.assay.variant.id)} className="inline-flex items-center rounded-md border border-paper-300 bg-white px-3.5 py-2 text-sm font-semibold text-ink-900 hover:bg-paper-100">
                Open {saved.assay.variant.label}
              </Link>
              <Button variant="primary" onClick={handleNext}>
                Enter another assay
              </Button>
            </div>
          </section>
        )}
        <section aria-labelledby="fit-title" className="space-y-4 rounded-lg border border-paper-200 bg-white p-4 shadow-card">
          <div>
            <h2 id="fit-title" className="text-base font-semibold">
              Live fit
            </h2>
            <p className="text-sm text-ink-500">Recomputed in this browser as you type. Click a point in the plot (or ⊘ in the grid) to exclude it.</p>
          </div>
          {live.preview ? (
            <LiveFitBoundary resetKey={JSON.stringify([live.preview.requestPoints, sUnit, vUnit, enzymeConcentration, model])}>
              {renderCharts({ points: chartPoints, fit: chosenFit, curveLabel: `${modelNames[model]} fit`, sUnit, vUnit, onPointClick: handleToggleExclusion })}
              <AssayFitSummary preview={live.preview} model={model} onModelChange={(next) => form.setValue('model', next)} sUnit={sUnit} vUnit={vUnit} />
            </LiveFitBoundary>
          ) : live.failure ? (
            <Notice tone="danger" title="The live fit failed for these points.">
              {live.failure}. Your points are kept; change them or the model to try again.
            </Notice>
          ) : (
            <p className="rounded-md border border-dashed border-paper-300 px-4 py-8 text-center text-sm text-ink-500">No points yet. Paste or type at least three substrate concentrations with their rates.</p>
          )}
        </section>
      </div>
    </form>

      <ExcludePointDialog
        pointDescription={excludingPoint ? describePoint(excludingPoint, sUnit, vUnit) : null}
        onClose={() => setExcluding(null)}
        onExclude={(reason) => {
          if (excluding !== null) setGrid(setExclusion(grid, excluding, reason));
          setExcluding(null);
        }}
      />
    </>
  );
}
