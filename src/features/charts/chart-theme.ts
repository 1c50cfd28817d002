import type { Config } from 'vega-lite';
import tailwindConfig from '../../../tailwind.config';

/**
 * Chart colours, read from the Tailwind theme so that charts and pages share one palette and no chart
 * writes a colour of its own. Vega needs plain colour values (it draws on a canvas and exports SVG), so
 * the tokens are read here rather than through CSS classes.
 */
const { colors, fontFamily } = tailwindConfig.theme.extend;

export const chartColors = {
  text: colors.ink[900],
  mutedText: colors.ink[600],
  axis: colors.ink[500],
  grid: colors.paper[200],
  frame: colors.paper[300],
  // The cards charts sit on are white; exported images carry the same background.
  background: 'white',
  fit: colors.lagoon[800],
  band: colors.lagoon[200],
  excluded: colors.ink[400],
  zeroLine: colors.ink[400],
  reference: colors.ink[600],
  highlight: colors.ember[600],
  optimum: colors.ember[600],
  diffusionRegion: colors.signal['caution-soft'],
  diffusionText: colors.signal.caution,
  isoLine: colors.paper[400],
  isoText: colors.ink[500],
  parent: colors.ink[700],
  variant: colors.lagoon[700],
  notMade: colors.paper[100],
  unmeasured: colors.paper[400],
  parentResidue: colors.ink[900],
} as const;

/**
 * The diverging scale for log10 fold change, centred on the parent (0): warm ember below (worse than the
 * parent), cool lagoon above (better), white in the middle. Orange against blue-green stays apart for
 * red–green colour-blind readers, and the lightness falls off symmetrically, so the scale also reads in grey.
 */
export const divergingRange = [
  colors.ember[700],
  colors.ember[500],
  colors.ember[100],
  'white',
  colors.lagoon[100],
  colors.lagoon[500],
  colors.lagoon[800],
];

/**
 * Series styles for replicates and other categories: colour and shape together, so that a series stays
 * identifiable without colour (and in a grey print).
 */
export const seriesStyles: readonly { color: string; shape: string }[] = [
  { color: colors.lagoon[700], shape: 'circle' },
  { color: colors.ember[600], shape: 'square' },
  { color: colors.ink[700], shape: 'triangle-up' },
  { color: colors.lagoon[500], shape: 'diamond' },
  { color: colors.ember[400], shape: 'triangle-down' },
  { color: colors.ink[500], shape: 'cross' },
];

/** The style of series `index`, cycling when there are more series than styles. */
export function seriesStyle(index: number): { color: string; shape: string } {
  return seriesStyles[index % seriesStyles.length];
}

/** Catalytic-role colours (the theme's Okabe–Ito palette), keyed by the role names the API uses. */
export const roleColors: Record<string, string> = {
  nucleophile: colors.role.nucleophile,
  'general acid': colors.role['general-acid'],
  'general base': colors.role['general-base'],
  'acid/base': colors.role['acid-base'],
  'metal ligand': colors.role['metal-ligand'],
  'oxyanion hole': colors.role['oxyanion-hole'],
  'substrate binding': colors.role['substrate-binding'],
  electrostatic: colors.role.electrostatic,
  other: colors.role.other,
};

const font = fontFamily.sans.join(', ');

/** The Vega-Lite config every chart is embedded with: our fonts, colours and quiet axes. */
export const vegaConfig: Config = {
  background: chartColors.background,
  font,
  padding: 8,
  view: { stroke: chartColors.frame },
  title: { anchor: 'start', color: chartColors.text, fontSize: 15, fontWeight: 600, subtitleColor: chartColors.mutedText, subtitleFontSize: 12, offset: 12 },
  axis: {
    labelColor: chartColors.mutedText,
    titleColor: chartColors.text,
    titleFontWeight: 600,
    titleFontSize: 12,
    labelFontSize: 11,
    domainColor: chartColors.axis,
    tickColor: chartColors.axis,
    gridColor: chartColors.grid,
  },
  legend: { labelColor: chartColors.text, titleColor: chartColors.text, titleFontWeight: 600, labelFontSize: 11, titleFontSize: 12, orient: 'right', labelLimit: 300, titleLimit: 320 },
  header: { labelColor: chartColors.text, titleColor: chartColors.text },
  text: { color: chartColors.text, font },
};
