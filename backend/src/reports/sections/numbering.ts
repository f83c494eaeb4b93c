/** The report's numbered sections in order: the figures follow the catalogue (calibration, limits, recovery and precision, accuracy and uncertainty). */
const REPORT_SECTIONS = [
  'summary',
  'calibration',
  'detection',
  'recoveryPrecision',
  'accuracyUncertainty',
  'outliers',
  'methods',
  'signatures',
  'caution',
] as const;

export type ReportSection = (typeof REPORT_SECTIONS)[number];

/** "5  Title", or "5.2  Title" for a part of a section. */
export function numbered(section: ReportSection, title: string, part?: number): string {
  const number = REPORT_SECTIONS.indexOf(section) + 1;
  return `${part === undefined ? number : `${number}.${part}`}  ${title}`;
}
