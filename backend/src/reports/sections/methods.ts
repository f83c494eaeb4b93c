import { colors, sizes, type PdfComposer } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { numbered } from './numbering.js';

export const STUDY_DATA_ATTACHMENT = 'study-data.json';

const FORMULAS: [topic: string, lines: string[]][] = [
  [
    'Calibration (least squares; ISO 8466-1)',
    [
      'Slope b = Sxy / Sxx and intercept a = ym - b xm, where xm, ym are the means, Sxx = sum of (x - xm)², Sxy = sum of (x - xm)(y - ym); sums on centred data.',
      'Residual SD s(y/x) = sqrt(sum of e² / (n - 2)); standard errors s(b) = s(y/x) / sqrt(Sxx) and s(a) = s(y/x) sqrt(sum of x² / (n Sxx)).',
      'Intervals: estimate ± t((1 + C)/2; df) × standard error, with C the confidence level of the study.',
      'Weighted fits: weights 1/x or 1/x², scaled to sum to n, in every sum above. Quadratic fits: y = a + b x + c x² by least squares, df = n - 3.',
      'Bands at x: confidence half-width t s(y/x) sqrt(1/n + (x - xm)²/Sxx); prediction half-width (one new reading) t s(y/x) sqrt(1 + 1/n + (x - xm)²/Sxx).',
      "Back-calculated standards x' = (y - a) / b and %RE = 100 (x' - x) / x. Standardised residual e / s(y/x).",
    ],
  ],
  [
    'Linearity and weighting',
    [
      'Lack of fit: F = (SS(lof) / df(lof)) / (SS(pe) / df(pe)), with pure error from the replicates at each level (Draper and Smith).',
      "Mandel's test: F = ((n - 2) s1² - (n - 3) s2²) / s2² with 1 and n - 3 degrees of freedom, decision at 99 % (ISO 8466-1; DIN 38402-51).",
      'Intercept: t = a / s(a) with n - 2 degrees of freedom. Variance check: F = s²(highest level) / s²(lowest level), one-sided at 99 %; the weighting with the smallest sum of |%RE| is recommended (common practice).',
    ],
  ],
  [
    'Detection and quantitation limits',
    [
      'ICH Q2(R2): LOD = 3.3 σ / b and LOQ = 10 σ / b, with σ the residual SD, the SD of the intercept or the SD of blank responses.',
      'Blank responses: mean + 3 SD and mean + 10 SD (IUPAC; common practice), converted with (response - a) / b.',
      'ISO 11843-2 (K readings): critical value x(c) = t(1 - α; n - 2) (s(y/x) / b) q and minimum detectable value x(d) = δ (s(y/x) / b) q, q = sqrt(1/K + 1/n + xm²/Sxx), δ from the non-central t distribution with β = α.',
      'Hubaux and Vos: the critical response y(C) = a + t(1 - α; n - 2) s(y/x) q; x(D) where the lower prediction limit reaches y(C).',
      '40 CFR 136 App. B (Rev. 2): MDL(s) = t(0.99; n(s) - 1) S(s) from spiked samples; MDL(b) from method blanks; MDL = the larger.',
    ],
  ],
  [
    'Recovery and precision (ISO 5725-2)',
    [
      'Recovery % = 100 (found - native) / added; t = (mean - 100) / (SD / sqrt(n)), two-sided.',
      'One-way ANOVA over the series: s(r) = sqrt(MS(within)); s(L) = sqrt(max(0, (MS(between) - MS(within)) / n0)); s(I) = sqrt(s(r)² + s(L)²); RSDs relative to the grand mean.',
      'Horwitz: PRSD(R) = 2^(1 - 0.5 log10 C) with C the mass fraction (AOAC writes the same curve as 2 C^-0.15); HorRat = RSD(I) / PRSD(R).',
    ],
  ],
  [
    'Accuracy profile, trueness and measurement uncertainty',
    [
      'Accuracy profile (total error): per level, a one-way random model over the series; β-expectation tolerance interval mean ± k s(I) with k = t((1 + β)/2; ν) sqrt(1 + 1/(I J B²)), B = sqrt((R + 1)/(J R + 1)), R = s²(between) / s²(r) and Satterthwaite ν (Mee 1984). Limits as % of the nominal value; the validity domain is where both stay inside ±λ, its ends read off a straight line between levels.',
      'Trueness against a reference material: difference = mean - certified; U = 2 sqrt(s²/n + u(certified)²); a difference larger than U shows a bias (common practice).',
      'Top-down uncertainty: u(Rw) = s(I) at each level; u(bias) = sqrt(RMS of the biases² + u(reference)²); uc = sqrt(u(Rw)² + u(bias)²); U = k uc (Nordtest TR 537).',
    ],
  ],
  [
    'Outliers and rounding',
    [
      'Grubbs G = max |v - mean| / s, two-sided at 5 %; Dixon r10 for 3 to 10 values; Cochran C = largest variance / sum of variances (ISO 5725-2).',
      'Printed figures are rounded for reading: coefficients to their standard error (two significant digits, JCGM 100:2008), other figures to three or four significant digits. Decisions use the unrounded values.',
    ],
  ],
];

const REFERENCES = [
  'ICH Q2(R2), Validation of analytical procedures (2023).',
  'ISO 8466-1, Water quality: calibration and evaluation of analytical methods, part 1: linear calibration function.',
  'ISO 11843-2, Capability of detection, part 2: methodology in the linear calibration case.',
  'ISO 5725-2, Accuracy (trueness and precision) of measurement methods and results, part 2: repeatability and reproducibility.',
  'US EPA, 40 CFR Part 136 Appendix B, Revision 2 (2017): definition and procedure for the determination of the method detection limit.',
  'Hubaux A., Vos G., Anal. Chem. 42 (1970) 849. Currie L. A., Anal. Chem. 40 (1968) 586.',
  'Horwitz W., Kamps L. R., Boyer K. W., J. Assoc. Off. Anal. Chem. 63 (1980); AOAC Official Methods of Analysis, Appendix F.',
  'Draper N. R., Smith H., Applied Regression Analysis (Wiley). Miller J. N., Miller J. C., Statistics and Chemometrics for Analytical Chemistry (Pearson).',
  'Mee R. W., Technometrics 26 (1984) 251. Hubert Ph. et al., J. Pharm. Biomed. Anal. 36 (2004) 579 (accuracy profile).',
  'Magnusson B. et al., Nordtest TR 537, Handbook for calculation of measurement uncertainty in environmental laboratories.',
  'JCGM 100:2008, Evaluation of measurement data: guide to the expression of uncertainty in measurement (GUM).',
];

export function methodsSection(pdf: PdfComposer, content: ReportContent, attachmentSha256: string): void {
  pdf.heading(numbered('methods', 'Statistical methods and references'));
  pdf.paragraph(
    "All figures come from the Meritline statistics engine. Standard deviations use the n - 1 divisor; t and F are quantiles of Student's t and Fisher's F distributions.",
  );
  for (const [topic, lines] of FORMULAS) {
    pdf.heading(topic, 3);
    pdf.bullets(lines, { size: 8.5 });
  }
  pdf.heading('References', 3);
  pdf.bullets(REFERENCES, { size: 8.5 });

  const sameHash = attachmentSha256 === content.study.dataHash;
  pdf.callout(
    'Recomputing every number',
    [
      `Engine version ${content.study.engineVersion}. SHA-256 of the study data (canonical JSON): ${content.study.dataHash}`,
      `The study data are attached to this PDF as ${STUDY_DATA_ATTACHMENT} and printed in the appendix. ` +
        (sameHash ? "The attachment's SHA-256 is the value above. " : `The attachment's SHA-256 is ${attachmentSha256}. `) +
        `Save it and run "npm run -s evaluate -- ${STUDY_DATA_ATTACHMENT}" with this engine version to obtain every figure in this report.`,
    ],
    'neutral',
  );
  pdf.paragraph('Canonical JSON: keys sorted, no spaces, numbers in their shortest round-trip form (the scheme of RFC 8785).', {
    size: sizes.small,
    color: colors.muted,
  });
}
