import type { AssayFit } from '@shared/assay/fit-assay';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { Notice } from '@/components/ui/notice';
import { formatNumber } from '@/lib/format';

/** Relative difference below which two fits are the same fit written twice (far below any SE). */
export const AGREEMENT_TOLERANCE = 1e-9;

interface Compared {
  name: string;
  unit: string;
  preview: number | null;
  server: number | null;
}

const relativeDifference = (a: number, b: number) => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b)));

/**
 * The preview's parameters beside the ones the server stored after its own fit, with their relative
 * difference: the check that what the kineticist saw is what was saved.
 */
export function SaveAgreement({ preview, measurement }: { preview: AssayFit; measurement: MeasurementDto }) {
  const { parameters } = preview;
  const rows: Compared[] = [
    { name: 'kcat', unit: 's⁻¹', preview: parameters.kcat.value, server: measurement.kcat?.value ?? null },
    { name: 'SE of kcat', unit: 's⁻¹', preview: parameters.kcat.se, server: measurement.kcat?.se ?? null },
    { name: 'Km', unit: 'M', preview: parameters.km.value, server: measurement.km?.value ?? null },
    { name: 'SE of Km', unit: 'M', preview: parameters.km.se, server: measurement.km?.se ?? null },
    { name: 'kcat/Km', unit: 'M⁻¹ s⁻¹', preview: parameters.kcatOverKm?.value ?? null, server: measurement.kcatOverKm?.value ?? null },
    { name: 'Vmax', unit: 'M s⁻¹', preview: parameters.vmax.value, server: measurement.vmax?.value ?? null },
    ...(parameters.ki ? [{ name: 'Ki', unit: 'M', preview: parameters.ki.value, server: measurement.ki?.value ?? null }] : []),
    ...(parameters.hill ? [{ name: 'Hill n', unit: '', preview: parameters.hill.value, server: measurement.hill?.value ?? null }] : []),
  ];
  const differences = rows.map((row) => (row.preview !== null && row.server !== null ? relativeDifference(row.preview, row.server) : row.preview === row.server ? 0 : Number.POSITIVE_INFINITY));
  const agree = differences.every((difference) => difference <= AGREEMENT_TOLERANCE);
  return (
    <section aria-labelledby="agreement-title" className="space-y-3">
      <h3 id="agreement-title" className="text-sm font-semibold">
        Preview and server fit
      </h3>
      {agree ? (
        <Notice tone="fine" title="The server's fit agrees with the preview.">Every parameter matches to within one part in 10⁹.</Notice>
      ) : (
        <Notice tone="danger" title="The server's fit differs from the preview.">The stored values are the server's. Check the points and the units, and tell the team: this should not happen.</Notice>
      )}
      <table className="w-full text-sm" aria-label="Preview and stored values">
        <thead className="text-left text-xs text-ink-500">
          <tr className="border-b border-paper-200">
            <th scope="col" className="py-1 pr-2 font-medium">Parameter</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Preview</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Stored by the server</th>
            <th scope="col" className="py-1 pr-2 text-right font-medium">Relative difference</th>
            <th scope="col" className="py-1 font-medium">Unit</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row, index) => (
            <tr key={row.name} className="border-b border-paper-100">
              <th scope="row" className="py-1 pr-2 text-left font-medium">{row.name}</th>
              <td className="numeric py-1 pr-2 font-mono" data-preview={row.name} data-value={row.preview ?? ''}>
                {formatNumber(row.preview, 6)}
              </td>
              <td className="numeric py-1 pr-2 font-mono" data-stored={row.name} data-value={row.server ?? ''}>
                {formatNumber(row.server, 6)}
              </td>
              <td className="numeric py-1 pr-2 font-mono">{differences[index] === 0 ? 'identical' : formatNumber(differences[index], 2)}</td>
              <td className="py-1 text-ink-700">{row.unit}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
