/**
 * The client's formatters. Numbers come from shared/format/numbers.ts, so pages and the digest e-mails
 * write them alike; dates are formatted here, in the reader's locale.
 */

export {
  energyIn,
  formatEnergy,
  formatEnergyFigures,
  formatFoldChange,
  formatKcat,
  formatKcatOverKm,
  formatKm,
  formatNumber,
  formatPh,
  powerOfTen,
} from '@shared/format/numbers';

export function formatDate(iso: string | null | undefined): string {
  return iso ? new Date(iso).toLocaleDateString(undefined, { dateStyle: 'medium' }) : '—';
}

export function formatDateTime(iso: string | null | undefined): string {
  return iso ? new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) : '—';
}
