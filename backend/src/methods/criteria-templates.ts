import type { MethodVersionSettings } from '@meritline/shared';
import type { CriteriaSet } from './method-version.entity.js';

export interface CriteriaTemplate {
  key: string;
  name: string;
  description: string;
  criteria: CriteriaSet;
  settings: MethodVersionSettings;
  note: string;
}

const REVIEW_CAUTION =
  'These are starting points, not requirements: set the limits your laboratory’s procedures, the method you follow and the regulations that apply require, and have them approved by qualified staff.';

/** Typical acceptance criteria by purpose; every threshold is common practice and labelled as such in `note`. */
export const CRITERIA_TEMPLATES: readonly CriteriaTemplate[] = [
  {
    key: 'assay',
    name: 'Assay of a major component',
    description: 'Content of the main component of a product or raw material, usually 80–120 % of the declared amount.',
    criteria: [
      { figure: 'calibration.r2', op: '>=', value: 0.999, label: 'Coefficient of determination r² at least 0.999' },
      {
        figure: 'interceptTest.interceptPctOfTopResponse',
        op: 'abs<=',
        value: 2,
        label: 'Intercept within ±2 % of the top standard’s response',
      },
      { figure: 'recovery.overall.meanPct', op: 'between', value: [98, 102], label: 'Mean recovery 98–102 %' },
      { figure: 'precision.rsdR', op: '<=', value: 2, label: 'Repeatability RSD at most 2 %' },
      { figure: 'precision.rsdI', op: '<=', value: 3, label: 'Intermediate precision RSD at most 3 %' },
    ],
    settings: { requiresQualityRelease: true, checkTolerancePct: 2, onePointMaxInterceptPct: 2 },
    note: `Common practice for assays in pharmaceutical and food quality control (ICH Q2(R2) leaves the limits to the laboratory): r² ≥ 0.999, intercept within ±2 % of the top response, mean recovery 98–102 %, repeatability RSD ≤ 2 %, intermediate precision RSD ≤ 3 %. Results that release product need qualified review. ${REVIEW_CAUTION}`,
  },
  {
    key: 'impurity',
    name: 'Impurity or trace determination',
    description: 'A minor component or contaminant near a specification limit, where the quantitation limit matters.',
    criteria: [
      { figure: 'calibration.r2', op: '>=', value: 0.99, label: 'Coefficient of determination r² at least 0.99' },
      { figure: 'recovery.overall.meanPct', op: 'between', value: [80, 120], label: 'Mean recovery 80–120 %' },
      { figure: 'precision.rsdR', op: '<=', value: 10, label: 'Repeatability RSD at most 10 %' },
    ],
    settings: { requiresQualityRelease: true, checkTolerancePct: 10, onePointMaxInterceptPct: 5 },
    note: `Common practice for impurities and trace levels: r² ≥ 0.99, mean recovery 80–120 %, repeatability RSD ≤ 10 %, and an LOQ at most the reporting threshold (often half the specification limit or less). Add a criterion such as detection.sdResidual.loq ≤ the threshold in your units once the limit is known. ${REVIEW_CAUTION}`,
  },
  {
    key: 'residue',
    name: 'Residue at a regulatory limit',
    description: 'A residue (pesticide, veterinary drug, contaminant) checked against a maximum residue limit in food or feed.',
    criteria: [
      { figure: 'calibration.r2', op: '>=', value: 0.99, label: 'Coefficient of determination r² at least 0.99' },
      { figure: 'range.rePct', op: 'abs<=', value: 20, label: 'Back-calculated standards within ±20 % at every level' },
      { figure: 'recovery.overall.meanPct', op: 'between', value: [70, 120], label: 'Mean recovery 70–120 %' },
      { figure: 'precision.rsdR', op: '<=', value: 20, label: 'Repeatability RSD at most 20 %' },
    ],
    settings: { requiresQualityRelease: false, checkTolerancePct: 20, onePointMaxInterceptPct: 5 },
    note: `Common practice in residue analysis (as in the EU guidance on analytical quality control for pesticide residues, recalled from memory): mean recovery 70–120 %, repeatability RSD ≤ 20 %, back-calculated standards within ±20 %; r² ≥ 0.99 is common practice on top. The LOQ must not exceed the regulatory limit: add detection.sdResidual.loq ≤ the limit in your units. ${REVIEW_CAUTION}`,
  },
  {
    key: 'environmental',
    name: 'Environmental trace analysis (water)',
    description: 'Anions, metals or organic traces in drinking, ground or surface water.',
    criteria: [
      { figure: 'calibration.r2', op: '>=', value: 0.995, label: 'Coefficient of determination r² at least 0.995' },
      { figure: 'recovery.overall.meanPct', op: 'between', value: [80, 120], label: 'Mean spike recovery 80–120 %' },
      { figure: 'precision.rsdR', op: '<=', value: 15, label: 'Repeatability RSD at most 15 %' },
    ],
    settings: { requiresQualityRelease: true, checkTolerancePct: 10, onePointMaxInterceptPct: 5 },
    note: `Common practice for water methods (as in US EPA methods, recalled from memory): r² ≥ 0.995, spike recovery 80–120 %, RSD ≤ 15 %, detection limit by the MDL procedure of 40 CFR 136 App. B. Drinking-water results bear on public health: report them under the laboratory’s procedures, after qualified review. ${REVIEW_CAUTION}`,
  },
];

export const TEMPLATE_KEYS = CRITERIA_TEMPLATES.map((template) => template.key);

export function findTemplate(key: string): CriteriaTemplate | undefined {
  return CRITERIA_TEMPLATES.find((template) => template.key === key);
}
