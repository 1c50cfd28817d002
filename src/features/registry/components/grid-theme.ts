import { themeQuartz } from 'ag-grid-community';
import tailwindConfig from '../../../../tailwind.config';

const { colors, fontFamily } = tailwindConfig.theme.extend;

/**
 * The registry grid in Kcatalog's own look: every colour and both typefaces come from the Tailwind
 * theme tokens, so the grid reads as part of the page (paper rows, ink text, lagoon selection and
 * hover, the ember focus ring the rest of the app uses) rather than as a stock data grid.
 */
export const registryGridTheme = themeQuartz.withParams({
  browserColorScheme: 'light',
  fontFamily: [...fontFamily.sans],
  headerFontFamily: [...fontFamily.sans],
  fontSize: 14,
  headerFontSize: 12.5,
  headerFontWeight: 600,
  spacing: 6,
  rowHeight: 38,
  headerHeight: 44,
  backgroundColor: colors.paper[50],
  dataBackgroundColor: colors.paper[50],
  oddRowBackgroundColor: colors.paper[100],
  foregroundColor: colors.ink[900],
  textColor: colors.ink[900],
  subtleTextColor: colors.ink[500],
  accentColor: colors.lagoon[600],
  borderColor: colors.paper[300],
  rowBorder: { color: colors.paper[200] },
  columnBorder: false,
  headerColumnBorder: { color: colors.paper[300] },
  headerColumnBorderHeight: '40%',
  headerBackgroundColor: colors.lagoon[50],
  headerTextColor: colors.lagoon[900],
  headerCellHoverBackgroundColor: colors.lagoon[100],
  headerRowBorder: { color: colors.lagoon[200], width: 2 },
  iconColor: colors.lagoon[700],
  rowHoverColor: colors.lagoon[50],
  selectedRowBackgroundColor: colors.lagoon[100],
  rangeSelectionBorderColor: colors.ember[500],
  rowLoadingSkeletonEffectColor: colors.paper[200],
  wrapperBorder: { color: colors.paper[300] },
  wrapperBorderRadius: 8,
  borderRadius: 4,
});
