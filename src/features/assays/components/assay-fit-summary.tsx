import type { Estimate } from '@shared/kinetics/types';
import { fromMolar, fromMolarPerSecond, kineticModels, type ConcentrationUnitInput, type KineticModelName, type RateUnitInput } from '@shared/schemas/assay';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { formatNumber } from '@/lib/format';
import { modelNames, type AssayPreview } from '../lib/assay-preview';
import { ParameterTable } from './parameter-table';

export interface AssayFitSummaryProps {
  preview: AssayPreview;
  model: KineticModelName;
  onModelChange: (model: KineticModelName) => void;
  sUnit: ConcentrationUnitInput;
  vUnit: RateUnitInput;
}

interface ParameterRow {
  name: string;
  /** SI value for machines (data-value), display values for people. */
  si: number;
  estimate: Estimate;
  unit: string;
}

// A singular fit has an infinite SE and an unbounded interval; those stay as they are (the unit converters
// refuse non-finite values) and are shown as such.
const finite = (value: number, convert: (value: number) => number) => (Number.isFinite(value) ? convert(value) : value);
const scaled = (estimate: Estimate, convert: (value: number) => number): Estimate => ({
  value: finite(estimate.value, convert),
  se: Math.abs(finite(estimate.se, convert)),
  ci95: [finite(estimate.ci95[0], convert), finite(estimate.ci95[1], convert)],
});

/** The live fit in numbers: the model choice, parameters with SE and 95 % CI, warnings and the model comparison. */
export function AssayFitSummary({ preview, model, onModelChange, sUnit, vUnit }: AssayFitSummaryProps) {
  const chosen = preview.chosen;
  const fit = chosen.fit;
  const rows: ParameterRow[] = [];
  if (fit && !chosen.error) {
    const { parameters } = fit;
    const toS = (molar: number) => fromMolar(molar, sUnit);
    if (preview.hasEnzyme) rows.push({ name: 'kcat', si: parameters.kcat.value, estimate: parameters.kcat, unit: 's⁻¹' });
    rows.push({ name: model === 'hill' ? 'K½' : 'Km', si: parameters.km.value, estimate: scaled(parameters.km, toS), unit: sUnit });
    if (preview.hasEnzyme && parameters.kcatOverKm) rows.push({ name: 'kcat/Km', si: parameters.kcatOverKm.value, estimate: parameters.kcatOverKm, unit: 'M⁻¹ s⁻¹' });
    rows.push({ name: 'Vmax', si: parameters.vmax.value, estimate: scaled(parameters.vmax, (value) => fromMolarPerSecond(value, vUnit)), unit: vUnit });
    if (parameters.ki) rows.push({ name: 'Ki', si: parameters.ki.value, estimate: scaled(parameters.ki, toS), unit: sUnit });
    if (parameters.hill) rows.push({ name: 'Hill n', si: parameters.hill.value, estimate: parameters.hill, unit: '' });
  }

  return (
    <div className="space-y-4">
      <fieldset>
        <legend className="text-sm font-medium text-ink-700">Model</legend>
        <div className="mt-1 flex flex-wrap gap-2">
          {kineticModels.map((name) => (
            <label key={name} className={`flex cursor-pointer items-center gap-2 rounded-md border px-3 py-1.5 text-sm ${name === model ? 'border-lagoon-500 bg-lagoon-50 font-semibold text-lagoon-900' : 'border-paper-300 bg-white'}`}>
              <input type="radio" name="fit-model" value={name} checked={name === model} onChange={() => onModelChange(name)} className="accent-lagoon-700" />
              {modelNames[name]}
            </label>
          ))}
        </div>
      </fieldset>

      {chosen.error && (
        <Notice tone="caution" title={`No ${modelNames[model]} fit yet`}>
          {chosen.error[0].toUpperCase() + chosen.error.slice(1)}.
        </Notice>
      )}
      {!preview.hasEnzyme && fit && <Notice tone="info" title="Enter the enzyme concentration [E]t to get kcat and kcat/Km (kcat = Vmax/[E]t)." />}

      {rows.length > 0 && fit && (
        <ParameterTable
          label="Fitted parameters"
          rows={rows.map((row) => ({
            name: row.name,
            storedValue: row.si,
            value: formatNumber(row.estimate.value, 4),
            se: Number.isFinite(row.estimate.se) ? formatNumber(row.estimate.se, 2) : '—',
            ci95: Number.isFinite(row.estimate.ci95[0]) && Number.isFinite(row.estimate.ci95[1]) ? `${formatNumber(row.estimate.ci95[0], 3)} – ${formatNumber(row.estimate.ci95[1], 3)}` : 'unbounded',
            unit: row.unit,
          }))}
        />
      )}
      {fit && !chosen.error && (
        <p className="text-xs text-ink-500">
          {fit.pointCount} points, {fit.degreesOfFreedom} degrees of freedom, residual SD {formatNumber(finite(fit.residualSdMolarPerSecond, (value) => fromMolarPerSecond(value, vUnit)), 3)} {vUnit}
          {fit.converged ? '' : ', did not converge'}. Fitted in this browser in {preview.elapsedMs.toFixed(1)} ms (three models); the server refits on save with the same code.
        </p>
      )}

      {fit && !chosen.error && (fit.warnings.length > 0 || preview.flags.length > 0) && (
        <div className="space-y-2" aria-label="Warnings">
          {preview.flags.map((flag) => (
            <Notice key={flag.code + flag.message} tone={flag.severity === 'implausible' ? 'danger' : 'caution'} title={flag.severity === 'implausible' ? 'Implausible value' : 'Check this'}>
              {flag.message[0].toUpperCase() + flag.message.slice(1)}.
            </Notice>
          ))}
          {fit.warnings.map((warning) => (
            <Notice key={warning} tone="caution" title="Fit warning">
              {warning[0].toUpperCase() + warning.slice(1)}.
            </Notice>
          ))}
        </div>
      )}

      <ModelComparisonTable preview={preview} model={model} onModelChange={onModelChange} />
    </div>
  );
}

function ModelComparisonTable({ preview, model, onModelChange }: { preview: AssayPreview; model: KineticModelName; onModelChange: (model: KineticModelName) => void }) {
  if (!preview.outcomes['michaelis-menten'].fit) return null;
  return (
    <section aria-labelledby="model-comparison-title" className="space-y-2">
      <h3 id="model-comparison-title" className="text-sm font-semibold text-ink-900">
        Michaelis–Menten against the richer models
      </h3>
      <table className="w-full text-sm">
        <thead className="text-left text-xs text-ink-500">
          <tr className="border-b border-paper-200">
            <th scope="col" className="py-1 pr-2 font-medium">Richer model</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">ΔAICc</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">F test p</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Akaike weight</th>
            <th scope="col" className="py-1 font-medium">The data support</th>
          </tr>
        </thead>
        <tbody>
          {preview.comparisons.map((outcome) => {
            const comparison = outcome.comparison;
            const supported = comparison?.preferred === 'richer' ? outcome.model : 'michaelis-menten';
            return (
              <tr key={outcome.model} className="border-b border-paper-100 align-top">
                <th scope="row" className="py-1 pr-2 text-left font-medium">{modelNames[outcome.model]}</th>
                {comparison ? (
                  <>
                    <td className="numeric py-1 pr-2 font-mono">{formatNumber(comparison.deltaAicc, 3)}</td>
                    <td className="numeric py-1 pr-2 font-mono">{formatNumber(comparison.pValue, 2)}</td>
                    <td className="numeric py-1 pr-2 font-mono">{formatNumber(comparison.richerAkaikeWeight, 2)}</td>
                    <td className="py-1">
                      <span className="font-medium">{modelNames[supported]}</span>
                      <span className="block text-xs text-ink-500">{comparison.reason}</span>
                      {supported !== model && (
                        <Button variant="quiet" className="mt-1 px-2 py-0.5 text-xs" onClick={() => onModelChange(supported)}>
                          Use {modelNames[supported]}
                        </Button>
                      )}
                    </td>
                  </>
                ) : (
                  <td colSpan={4} className="py-1 text-ink-500">
                    Not compared: {outcome.error}.
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </section>
  );
}
