import type { TopLevelSpec } from 'vega-lite';
import { chartColors, divergingRange, roleColors } from '../chart-theme';
import { VEGA_LITE_SCHEMA, type ChartWithData } from './spec-parts';

/** One single-substitution variant in the map. */
export interface HeatMapCell {
  position: number;
  /** The substituted residue (one-letter, `*` for stop). */
  to: string;
  variantId: number;
  label: string;
  status: string;
  measurementCount: number;
  foldChange: number | null;
  log10FoldChange: number | null;
  ddgKjPerMol: number | null;
}

export interface HeatMapPosition {
  position: number;
  parentResidue: string;
  catalyticRoles: readonly string[];
}

export interface HeatMapSpecInput {
  title: string;
  subtitle?: string;
  aminoAcids: readonly string[];
  positions: readonly HeatMapPosition[];
  cells: readonly HeatMapCell[];
  /** Clicking a parent-residue dot opens the parent. */
  parentVariantId: number | null;
}

/** Share of the cells whose |log10 fold change| the colour scale spans before it clamps. */
const SPAN_QUANTILE = 0.9;

/** A number with its sign (U+2212 for minus), as effects are written. */
function signed(value: number, digits: number): string {
  const text = Math.abs(value).toFixed(digits);
  return value < 0 ? `\u2212${text}` : `+${text}`;
}

/** Legend names of the cell states that are not a colour of the scale. */
export const NO_VARIANT_LABEL = 'No variant (or filtered out)';
export const NOT_COMPARED_LABEL = 'Registered, not compared with the parent';
const PARENT_RESIDUE_LABEL = 'Parent residue';

/** The widest and narrowest cells, px: narrow enough for 500 positions, wide enough to click in a small map. */
const MAX_CELL_PX = 40;
const MIN_CELL_PX = 4;
/** The width the map aims to fill before it scrolls, px. */
const TARGET_WIDTH_PX = 1100;
/** Room one position label needs, px (`W160`). */
const LABEL_ROOM_PX = 32;

/**
 * The largest |log10 fold change| the colour scale spans: the 90th percentile of the data, rounded up to
 * half a decade, between one and four decades, so that one extreme knockout does not wash out the rest
 * (values beyond are drawn in the end colour; the scale clamps).
 */
export function colourSpan(values: readonly number[]): number {
  if (values.length === 0) return 1;
  const sorted = values.map(Math.abs).sort((a, b) => a - b);
  const high = sorted[Math.min(sorted.length - 1, Math.floor(SPAN_QUANTILE * sorted.length))];
  return Math.min(4, Math.max(1, Math.ceil(high * 2) / 2));
}

/**
 * The fitness landscape of a campaign's single substitutions: positions along, amino acids down, each
 * cell coloured by log10 of the kcat/Km fold change over the matched parent on a diverging scale centred
 * on zero (the parent). Variants without a comparison are grey, cells without a variant show the
 * background, the parent residue of each position is a dot, and a strip above marks catalytic positions
 * by role.
 *
 * @param input amino acids, positions, cells and the parent's id
 * @returns a Vega-Lite spec with datasets `catalytic`, `notCompared`, `measured` and `parentResidues`, kept out
 *   of the spec so that ten thousand rows are not copied through the Vega-Lite compiler
 */
export function heatMapSpec(input: HeatMapSpecInput): ChartWithData {
  const siteOf = new Map(input.positions.map((position) => [position.position, `${position.parentResidue}${position.position}`]));
  const sites = input.positions.map((position) => siteOf.get(position.position)!);
  const step = Math.max(MIN_CELL_PX, Math.min(MAX_CELL_PX, Math.floor(TARGET_WIDTH_PX / Math.max(sites.length, 1))));
  const rowStep = Math.max(12, Math.min(18, step));
  const labelEvery = Math.max(1, Math.ceil(LABEL_ROOM_PX / step));
  const labelled = sites.filter((_, index) => index % labelEvery === 0);

  // Drawing ten thousand cells is dominated by what runs per cell, so the cell marks carry no expression
  // that can be avoided: tooltips are written here once per cell (a Vega-Lite tooltip field becomes an
  // interpreted expression per cell and field), cells have a fixed size, and per-cell ARIA descriptions are
  // off (the figure's description speaks for the map).
  const measured = input.cells
    .filter((cell) => cell.log10FoldChange !== null)
    .map((cell) => ({
      site: siteOf.get(cell.position) ?? String(cell.position),
      to: cell.to,
      variantId: cell.variantId,
      log10FoldChange: cell.log10FoldChange,
      tip: {
        Variant: cell.label,
        'log₁₀ fold change': signed(cell.log10FoldChange!, 2),
        'Fold change (kcat/Km)': `${Number(cell.foldChange!.toPrecision(3))}×`,
        'ΔΔG‡ (kJ/mol)': cell.ddgKjPerMol === null ? '—' : signed(cell.ddgKjPerMol, 2),
        Status: cell.status,
        Measurements: String(cell.measurementCount),
      },
    }));
  const notCompared = input.cells
    .filter((cell) => cell.log10FoldChange === null)
    .map((cell) => ({
      site: siteOf.get(cell.position) ?? String(cell.position),
      to: cell.to,
      variantId: cell.variantId,
      state: NOT_COMPARED_LABEL,
      tip: { Variant: cell.label, Status: cell.status, Measurements: String(cell.measurementCount), 'Fold change': 'not compared with a matched parent' },
    }));
  const span = colourSpan(measured.map((cell) => cell.log10FoldChange!));
  const clamped = measured.some((cell) => Math.abs(cell.log10FoldChange!) > span);
  const tooltip = { field: 'tip', type: 'nominal' } as const;
  const parentResidues = input.positions
    .filter((position) => input.aminoAcids.includes(position.parentResidue))
    .map((position) => ({
      site: siteOf.get(position.position)!,
      to: position.parentResidue,
      variantId: input.parentVariantId,
      kind: PARENT_RESIDUE_LABEL,
      tip: { Position: siteOf.get(position.position)!, Residue: `${position.parentResidue}, as in the parent` },
    }));
  const catalytic = input.positions
    .filter((position) => position.catalyticRoles.length > 0)
    .map((position) => ({ site: siteOf.get(position.position)!, role: position.catalyticRoles[0], roles: position.catalyticRoles.join(', ') }));
  const roles = [...new Set(catalytic.map((site) => site.role))];

  const x = {
    field: 'site',
    type: 'ordinal',
    title: 'Position (parent residue and number)',
    sort: null,
    scale: { domain: sites },
    axis: { values: labelled, labelAngle: 0, labelFontSize: 10, labelOverlap: true },
  } as const;
  const aminoAcidDomain = [...input.aminoAcids];
  const y = { field: 'to', type: 'ordinal', title: 'Substituted residue', sort: null, scale: { domain: aminoAcidDomain }, axis: { labelFontSize: 10 } } as const;
  // The roles' legend above the strip, the map's below the map, so the strip sits right on the map.
  const legend = { orient: 'bottom', direction: 'horizontal' } as const;

  const spec: TopLevelSpec = {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: input.title,
      subtitle: [...(input.subtitle ? [input.subtitle] : []), ...(clamped ? [`Colours stop at ±${span} (${Number((10 ** span).toPrecision(2))}-fold); larger effects take the end colours.`] : [])],
    },
    description: `Heat map of log10 fold change in kcat/Km for ${input.cells.length} single-substitution variants at ${sites.length} positions; ${measured.length} compared with the parent.`,
    spacing: 4,
    vconcat: [
      {
        width: { step },
        height: 12,
        data: { name: 'catalytic' },
        mark: { type: 'rect' },
        encoding: {
          x: { ...x, axis: null },
          color: {
            field: 'role',
            type: 'nominal',
            title: 'Catalytic site',
            scale: { domain: roles, range: roles.map((role) => roleColors[role] ?? chartColors.reference) },
            legend: { orient: 'top', direction: 'horizontal' },
          },
          tooltip: [
            { field: 'site', type: 'nominal', title: 'Position' },
            { field: 'roles', type: 'nominal', title: 'Catalytic role' },
          ],
        },
      },
      {
        width: { step },
        height: { step: rowStep },
        view: { fill: chartColors.notMade, stroke: chartColors.frame },
        layer: [
          {
            data: { name: 'notCompared' },
            mark: { type: 'rect', cursor: 'pointer', invalid: null, aria: false, width: step, height: rowStep },
            encoding: {
              x,
              y,
              fill: {
                field: 'state',
                type: 'nominal',
                title: null,
                scale: { domain: [NO_VARIANT_LABEL, NOT_COMPARED_LABEL], range: [chartColors.notMade, chartColors.unmeasured] },
                legend: { ...legend, symbolType: 'square', symbolStrokeColor: chartColors.frame, symbolStrokeWidth: 1 },
              },
              tooltip,
            },
          },
          {
            data: { name: 'measured' },
            mark: { type: 'rect', cursor: 'pointer', invalid: null, aria: false, width: step, height: rowStep },
            encoding: {
              x,
              y,
              color: {
                field: 'log10FoldChange',
                type: 'quantitative',
                title: 'log₁₀ fold change in kcat/Km (0 = parent)',
                scale: { type: 'linear', domain: [-span, span], domainMid: 0, range: divergingRange, clamp: true },
                legend: { ...legend, gradientLength: 220, titleLimit: 320 },
              },
              tooltip,
            },
          },
          {
            data: { name: 'parentResidues' },
            mark: { type: 'point', filled: true, size: Math.max(6, Math.min(30, step * 1.2)), cursor: 'pointer', invalid: null, aria: false },
            encoding: {
              x,
              y,
              shape: { field: 'kind', type: 'nominal', title: null, scale: { domain: [PARENT_RESIDUE_LABEL], range: ['circle'] }, legend },
              color: { value: chartColors.parentResidue },
              tooltip,
            },
          },
        ],
      },
    ],
    resolve: { scale: { color: 'independent' }, legend: { color: 'independent' } },
  };
  return { spec, datasets: { catalytic, notCompared, measured, parentResidues } };
}
