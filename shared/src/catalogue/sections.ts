/**
 * Header words that name each column of a study section, for pasted grids and imported files alike.
 * The app's own template headers are the first word of each list, so a filled-in template always maps back.
 */
const RESPONSE = [
  'response',
  'y',
  'signal',
  'area',
  'peak area',
  'height',
  'peak height',
  'absorbance',
  'abs',
  'intensity',
  'counts',
  'reading',
  'ratio',
  'area ratio',
  'peak area ratio',
  'response ratio',
];

export const SECTION_HEADER_ALIASES = {
  standards: {
    x: ['concentration', 'x', 'conc', 'nominal', 'level', 'amount', 'standard', 'std', 'calibrator'],
    y: RESPONSE,
    id: ['id', 'name', 'label', 'sample', 'sample id', 'vial'],
  },
  blanks: { value: ['blank response', 'value', 'blank', 'blanks', ...RESPONSE] },
  recovery: {
    // "Spike" names the spiked sample (the template's first column), never the amount added.
    id: ['spike', 'id', 'sample', 'sample id', 'name', 'replicate'],
    level: ['level', 'spike level', 'fortification level'],
    added: ['added', 'amount added', 'spike added', 'spiked amount', 'fortified', 'nominal'],
    found: ['found', 'measured', 'result', 'determined', 'amount found'],
    native: ['native', 'background', 'unspiked', 'endogenous'],
  },
  precision: {
    group: ['series', 'group', 'day', 'run', 'batch', 'analyst', 'instrument'],
    value: ['result', 'value', 'found', 'measured', 'concentration', 'conc', 'x'],
  },
  unknowns: {
    id: ['sample', 'id', 'sample id', 'name', 'label'],
    y: RESPONSE,
    dilution: ['dilution factor', 'dilution', 'df', 'dil'],
  },
  accuracy: {
    level: ['level', 'concentration level', 'spike level', 'fortification level'],
    series: ['series', 'day', 'run', 'batch', 'group', 'analyst', 'instrument'],
    nominal: ['nominal', 'target', 'expected', 'reference value', 'true value', 'added', 'spiked'],
    found: ['found', 'measured', 'result', 'determined', 'back calculated', 'amount found'],
  },
  lowSpikes: {
    spiked: ['low level spike result', 'spiked', 'spike', 'spiked result', 'spiked sample', 'low spike'],
    blank: ['blank result', 'blank', 'blanks', 'method blank'],
  },
} as const satisfies Record<string, Record<string, readonly string[]>>;

export type HeaderSection = keyof typeof SECTION_HEADER_ALIASES;

export const headerAliases = <S extends HeaderSection>(section: S, key: keyof (typeof SECTION_HEADER_ALIASES)[S]): string[] => [
  ...(SECTION_HEADER_ALIASES[section][key] as readonly string[]),
];
