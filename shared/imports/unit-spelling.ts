/**
 * How spreadsheets write units, and the one spelling the API accepts for each. Headers such as
 * `Km (mM)`, `kcat [1/s]`, `kcat/Km (M-1 s-1)` or `v0 (umol/L/min)` come from many programs and
 * keyboards; each is compacted (Unicode compatibility forms folded, spaces and multiplication signs
 * dropped, superscript and caret exponents written as `-1`) and then looked up in a table generated from
 * the accepted units, so that only listed forms are ever converted.
 */

/** The kinds of unit an imported column can carry. */
export type UnitKind = 'concentration' | 'turnover' | 'rate' | 'specificity' | 'temperature' | 'phRate';

/** Concentrations in the API's spelling (µ is U+00B5 MICRO SIGN). */
export const importConcentrationUnits = ['M', 'mM', 'µM', 'nM'] as const;
/** First-order rate constants. */
export const importTurnoverUnits = ['1/s', '1/min'] as const;
/** Initial rates: concentration per time. */
export const importRateUnits = importConcentrationUnits.flatMap((c) => [`${c}/s`, `${c}/min`] as const);
/** Second-order rate constants. */
export const importSpecificityUnits = importConcentrationUnits.flatMap((c) => [`${c}⁻¹ s⁻¹`, `${c}⁻¹ min⁻¹`] as const);
/** Temperatures: degrees Celsius or kelvin. */
export const importTemperatureUnits = ['°C', 'K'] as const;

/** The units each kind accepts, in the API's spelling. */
export const unitsOfKind: Record<UnitKind, readonly string[]> = {
  concentration: importConcentrationUnits,
  turnover: importTurnoverUnits,
  rate: importRateUnits,
  specificity: importSpecificityUnits,
  temperature: importTemperatureUnits,
  phRate: [...importTurnoverUnits, ...importSpecificityUnits, ...importRateUnits],
};

/** What a rate unit of a pH series measures: kcat (s⁻¹), kcat/Km (M⁻¹ s⁻¹) or v0 (M s⁻¹). */
export type PhRateKindOfUnit = 'kcat' | 'kcatOverKm' | 'v0';

// Written forms of each concentration before compaction; `u` stands for micro where µ cannot be typed.
const CONCENTRATION_FORMS: Record<(typeof importConcentrationUnits)[number], string[]> = {
  M: ['M', 'mol/L', 'mol/l', 'mol dm-3', 'molar'],
  mM: ['mM', 'mmol/L', 'mmol/l', 'millimolar'],
  'µM': ['µM', 'μM', 'uM', 'µmol/L', 'μmol/L', 'umol/L', 'µmol/l', 'umol/l', 'micromolar'],
  nM: ['nM', 'nmol/L', 'nmol/l', 'nanomolar'],
};
const TIME_FORMS: Record<'s' | 'min', string[]> = { s: ['s', 'sec'], min: ['min'] };

/**
 * Folds one written unit into the form the lookup table is keyed by.
 *
 * @param text a unit as written, e.g. `M⁻¹·s⁻¹`, `1/(mM*min)` or `µmol L-1 min-1`
 * @returns the compact form, e.g. `M-1s-1`
 * @example compactUnit('M⁻¹ s⁻¹') // 'M-1s-1'
 */
export function compactUnit(text: string): string {
  return (
    text
      // NFKC turns ⁻¹ into −1, ℃ into °C and the micro sign into Greek mu.
      .normalize('NFKC')
      .replace(/[\u2212\u2012\u2013\u2014]/g, '-')
      .replace(/μ/g, 'µ')
      .replace(/\^\(?-1\)?/g, '-1')
      .replace(/\*\*-1/g, '-1')
      .replace(/[\s*·⋅×.]/g, '')
      .replace(/^per/, '/')
      .replace(/^º/, '°')
  );
}

function addForms(table: Map<string, string>, canonical: string, forms: Iterable<string>): void {
  for (const form of forms) table.set(compactUnit(form), canonical);
}

// Concentration per litre is already written with a slash (µmol/L); a rate then divides once more.
function concentrationTimesTime(concentration: string, time: string): string[] {
  return [`${concentration}/${time}`, `${concentration} ${time}-1`, `${concentration}·${time}⁻¹`, `${concentration} per ${time}`];
}

const TABLES: Record<Exclude<UnitKind, 'phRate'>, Map<string, string>> = (() => {
  const concentration = new Map<string, string>();
  const turnover = new Map<string, string>();
  const rate = new Map<string, string>();
  const specificity = new Map<string, string>();
  const temperature = new Map<string, string>();
  for (const [canonical, forms] of Object.entries(CONCENTRATION_FORMS)) addForms(concentration, canonical, forms);
  for (const [time, forms] of Object.entries(TIME_FORMS) as ['s' | 'min', string[]][]) {
    const canonicalTurnover = `1/${time}`;
    addForms(turnover, canonicalTurnover, forms.flatMap((form) => [`1/${form}`, `/${form}`, `${form}-1`, `${form}⁻¹`, `per ${form}`]));
    for (const [concentrationUnit, concentrationForms] of Object.entries(CONCENTRATION_FORMS)) {
      addForms(
        rate,
        `${concentrationUnit}/${time}`,
        concentrationForms.flatMap((c) => forms.flatMap((t) => concentrationTimesTime(c, t))),
      );
      // Only the molar spellings read sensibly inverted (M-1, mM-1); mol/L would need L/mol.
      const inverted = concentrationForms.filter((c) => !c.includes('/') && !c.endsWith('molar'));
      addForms(
        specificity,
        `${concentrationUnit}⁻¹ ${time}⁻¹`,
        inverted.flatMap((c) =>
          forms.flatMap((t) => [`${c}-1 ${t}-1`, `${c}⁻¹ ${t}⁻¹`, `1/(${c} ${t})`, `1/(${c}*${t})`, `1/${c}/${t}`, `/${c}/${t}`, `${c}-1/${t}`]),
        ),
      );
    }
  }
  addForms(temperature, '°C', ['°C', '℃', 'C', 'degC', 'deg C', 'oC', 'Celsius', 'celsius']);
  addForms(temperature, 'K', ['K', 'kelvin', 'Kelvin']);
  return { concentration, turnover, rate, specificity, temperature };
})();

/**
 * The accepted spelling of a unit written in a spreadsheet, for one kind of quantity.
 *
 * @param text the unit as written (e.g. `uM`, `M-1 s-1`, `umol/L/min`)
 * @param kind the quantity's kind; `phRate` accepts a turnover, specificity or rate unit
 * @returns the API's spelling (e.g. `µM`, `M⁻¹ s⁻¹`, `µM/min`), or undefined when the text is no unit of that kind
 * @example canonicalUnit('M-1 s-1', 'specificity') // 'M⁻¹ s⁻¹'
 * @example canonicalUnit('mg/mL', 'concentration') // undefined
 */
export function canonicalUnit(text: string, kind: UnitKind): string | undefined {
  const compact = compactUnit(text.trim());
  if (compact === '') return undefined;
  if (kind === 'phRate') {
    return TABLES.turnover.get(compact) ?? TABLES.specificity.get(compact) ?? TABLES.rate.get(compact);
  }
  return TABLES[kind].get(compact);
}

/**
 * Which quantity a pH-series rate unit measures.
 *
 * @param unit a unit in the API's spelling (from {@link canonicalUnit} with kind `phRate`)
 * @returns `kcat`, `kcatOverKm` or `v0`
 * @example phRateKindOfUnit('M⁻¹ s⁻¹') // 'kcatOverKm'
 */
export function phRateKindOfUnit(unit: string): PhRateKindOfUnit {
  if ((importTurnoverUnits as readonly string[]).includes(unit)) return 'kcat';
  if ((importSpecificityUnits as readonly string[]).includes(unit)) return 'kcatOverKm';
  return 'v0';
}

/** The unit kinds a written unit belongs to, for telling apart headers that share a name. */
export function unitKindsOf(text: string): Exclude<UnitKind, 'phRate'>[] {
  return (Object.keys(TABLES) as Exclude<UnitKind, 'phRate'>[]).filter((kind) => canonicalUnit(text, kind) !== undefined);
}
