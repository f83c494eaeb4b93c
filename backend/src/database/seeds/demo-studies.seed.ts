import type { EntityManager } from 'typeorm';
import type { StudyMeta, StudyStatus } from '@meritline/shared';
import { AuditService } from '../../audit/audit.service.js';
import { MethodVersion } from '../../methods/method-version.entity.js';
import { evaluateStudyData, withMethodDefaults, type StudyData } from '../../studies/study-evaluation.js';
import { saveNewStudy } from '../../studies/study-record.js';
import { User } from '../../users/user.entity.js';
import { daysAgo, DEMO_METHODS } from './demo-methods.seed.js';

/** Titles of the demo studies, for seeders that add to them (signatures, comments, reports). */
export const DEMO_STUDIES = {
  nitrateInitial: 'Nitrate by IC: initial validation',
  nitrateApproved: 'Nitrate by IC after the column change',
  dyeSubmitted: 'Tartrazine in soft drinks: method validation',
  pesticideReturned: 'Chlorpyrifos in apples: validation at 1–100 µg/kg',
  nitrateDraft: 'Nitrate by IC: bottled mineral water',
  pesticideDraft: 'Chlorpyrifos in pears: matrix extension',
  caffeineInitial: 'Caffeine by HPLC-UV: initial validation',
  caffeineSonication: 'Caffeine by HPLC-UV: degassing by sonication',
  caffeineDetector: 'Caffeine by HPLC-UV: diode-array detector',
  dyeAccuracy: 'Tartrazine in soft drinks: accuracy profile and uncertainty',
} as const;

/** Deterministic noise (mulberry32 and Box–Muller), so every demo database holds the same invented numbers. */
function noiseSource(seed: number) {
  let state = seed;
  const uniform = () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return (sd: number) => sd * Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

const round = (value: number, decimals: number) => Number(value.toFixed(decimals));

interface Scenario {
  seed: number;
  slope: number;
  intercept: number;
  levels: number[];
  /** SD of one response at a true response y. */
  responseSd: (y: number) => number;
  yDecimals: number;
  xDecimals: number;
  blanks?: { n: number; sd: number };
  /** Spikes added at the low, mid and high level, n samples each. */
  recovery?: { native: number; added: [low: number, mid: number, high: number]; n: number; meanPct: number; sdPct: number };
  precision?: { days: number; n: number; mean: number; rsdPct: number; betweenRsdPct: number };
  unknowns?: { id: string; x: number; m: number; dilution?: number }[];
  lowSpikes?: { level: number; n: number; sd: number; blanks: (number | null)[] };
  /** Levels × series × replicates of samples of known content; RSDs in %. */
  accuracy?: {
    levels: { level: string; nominal: number; biasPct: number; rsdPct: number; betweenRsdPct: number }[];
    series: number;
    replicates: number;
  };
  referenceMaterial?: { certified: number; uCertified: number; biasPct: number; rsdPct: number; n: number };
  extra?: Partial<StudyData>;
}

function studyData(s: Scenario): StudyData {
  const noise = noiseSource(s.seed);
  const response = (x: number) => s.intercept + s.slope * x;
  const data: StudyData = {
    model: 'linear',
    weighting: 'none',
    standards: s.levels.flatMap((x) => [0, 1, 2].map(() => ({ x, y: round(response(x) + noise(s.responseSd(response(x))), s.yDecimals) }))),
    ...s.extra,
  };
  if (s.blanks) {
    const { n, sd } = s.blanks;
    data.blanks = Array.from({ length: n }, () => round(s.intercept + noise(sd), s.yDecimals));
  }
  if (s.recovery) {
    const { native, added, n, meanPct, sdPct } = s.recovery;
    data.recovery = (['low', 'mid', 'high'] as const).flatMap((level, l) =>
      Array.from({ length: n }, (_, i) => ({
        id: `${level[0].toUpperCase()}${i + 1}`,
        level,
        added: added[l],
        found: round(native + (added[l] * (meanPct + noise(sdPct))) / 100, s.xDecimals),
        native,
      })),
    );
  }
  if (s.precision) {
    const { days, n, mean, rsdPct, betweenRsdPct } = s.precision;
    data.precision = Array.from({ length: days }, (_, day) => {
      const dayMean = mean * (1 + noise(betweenRsdPct) / 100);
      return Array.from({ length: n }, () => ({ group: `day ${day + 1}`, value: round(dayMean * (1 + noise(rsdPct) / 100), s.xDecimals) }));
    }).flat();
  }
  if (s.unknowns) {
    data.unknowns = s.unknowns.map(({ id, x, m, dilution }) => ({
      id,
      y: Array.from({ length: m }, () =>
        round(response(x / (dilution ?? 1)) + noise(s.responseSd(response(x / (dilution ?? 1)))), s.yDecimals),
      ),
      ...(dilution ? { dilution } : {}),
    }));
  }
  if (s.accuracy) {
    const { levels, series, replicates } = s.accuracy;
    data.accuracy = levels.flatMap(({ level, nominal, biasPct, rsdPct, betweenRsdPct }) =>
      Array.from({ length: series }, (_, day) => {
        const dayMean = nominal * (1 + (biasPct + noise(betweenRsdPct)) / 100);
        return Array.from({ length: replicates }, () => ({
          level,
          series: `day ${day + 1}`,
          nominal,
          found: round(dayMean + (nominal * noise(rsdPct)) / 100, s.xDecimals),
        }));
      }).flat(),
    );
  }
  if (s.referenceMaterial) {
    const { certified, uCertified, biasPct, rsdPct, n } = s.referenceMaterial;
    data.referenceMaterial = {
      certified,
      uCertified,
      results: Array.from({ length: n }, () => round(certified * (1 + (biasPct + noise(rsdPct)) / 100), s.xDecimals)),
    };
  }
  if (s.lowSpikes) {
    const { level, n, sd, blanks } = s.lowSpikes;
    data.lowSpikes = { spiked: Array.from({ length: n }, () => round(level + noise(sd), s.xDecimals + 1)), blanks };
  }
  return data;
}

const nitrate = (seed: number, levels: number[]): Scenario => ({
  seed,
  slope: 0.1523,
  intercept: 0.0031,
  levels,
  responseSd: (y) => 0.0012 + 0.004 * y,
  yDecimals: 4,
  xDecimals: 3,
  blanks: { n: 10, sd: 0.0011 },
  recovery: { native: 3.84, added: [1, 10, Math.max(...levels) * 0.8], n: 3, meanPct: 99.2, sdPct: 2.2 },
  precision: { days: 3, n: 5, mean: 10.02, rsdPct: 1.1, betweenRsdPct: 0.7 },
  unknowns: [
    { id: 'W-2611 tap water, Riverside', x: 12.4, m: 2 },
    { id: 'W-2612 well, Oak Farm', x: 27.9, m: 2 },
    { id: 'W-2613 tap water, Hill Road', x: 0.35, m: 2 },
    { id: 'W-2614 well, Marsh Lane', x: 61.8, m: 2, dilution: 2 },
  ],
  lowSpikes: { level: 0.2, n: 7, sd: 0.011, blanks: [0.012, null, 0.008, null, 0.015, 0.006, null] },
});

const tartrazine: Scenario = {
  seed: 2006,
  slope: 0.0505,
  intercept: 0.0018,
  levels: [1, 2, 4, 6, 8, 10, 12],
  responseSd: (y) => 0.0004 + 0.0015 * y,
  yDecimals: 4,
  xDecimals: 3,
  blanks: { n: 6, sd: 0.0004 },
  recovery: { native: 0, added: [2, 5, 10], n: 3, meanPct: 100.2, sdPct: 0.6 },
  precision: { days: 3, n: 6, mean: 5.04, rsdPct: 0.7, betweenRsdPct: 0.5 },
  unknowns: [
    { id: 'S-3101 orange soda', x: 31.2, m: 3, dilution: 5 },
    { id: 'S-3102 lemon drink', x: 18.7, m: 3, dilution: 5 },
    { id: 'S-3103 sports drink', x: 6.4, m: 3 },
  ],
};

/** Tartrazine with an accuracy design: the lowest level scatters too much for ±10 %, so the profile starts above it. */
const tartrazineAccuracy: Scenario = {
  ...tartrazine,
  seed: 3120,
  recovery: undefined,
  precision: undefined,
  unknowns: [{ id: 'S-3140 orange soda', x: 24.6, m: 3, dilution: 5 }],
  accuracy: {
    series: 3,
    replicates: 3,
    levels: [
      { level: 'L1', nominal: 1, biasPct: 3.5, rsdPct: 4.5, betweenRsdPct: 3 },
      { level: 'L2', nominal: 5, biasPct: 0.8, rsdPct: 0.9, betweenRsdPct: 0.6 },
      { level: 'L3', nominal: 10, biasPct: -0.4, rsdPct: 0.7, betweenRsdPct: 0.5 },
    ],
  },
  referenceMaterial: { certified: 7.5, uCertified: 0.06, biasPct: 0.6, rsdPct: 0.8, n: 5 },
  extra: { uncertainty: { relativeAbove: 2 } },
};

const chlorpyrifos = (seed: number): Scenario => ({
  seed,
  slope: 0.0118,
  intercept: 0.0009,
  levels: [1, 2, 5, 10, 20, 50, 100],
  responseSd: (y) => 0.00015 + 0.035 * y,
  yDecimals: 5,
  xDecimals: 2,
  blanks: { n: 6, sd: 0.0002 },
  recovery: { native: 0, added: [10, 50, 100], n: 5, meanPct: 93, sdPct: 6 },
  precision: { days: 3, n: 4, mean: 48.6, rsdPct: 7, betweenRsdPct: 4 },
  unknowns: [
    { id: 'A-5521 apples, lot 14', x: 3.1, m: 2 },
    { id: 'A-5522 apples, lot 15', x: 0.6, m: 2 },
    { id: 'A-5523 apples, lot 16', x: 27, m: 2 },
  ],
  lowSpikes: { level: 2, n: 7, sd: 0.25, blanks: [null, null, null, null, null, null, null] },
  extra: { weighting: '1/x2', massFraction: 5e-8 },
});

/** Invented caffeine assay; the detector of version 3 is about 15 % more sensitive. */
const caffeine = (seed: number, slope: number, recoveryPct: number): Scenario => ({
  seed,
  slope,
  intercept: 0.9,
  levels: [20, 40, 60, 80, 100, 120],
  responseSd: (y) => 0.6 + 0.0025 * y,
  yDecimals: 2,
  xDecimals: 2,
  recovery: { native: 0, added: [40, 80, 100], n: 3, meanPct: recoveryPct, sdPct: 0.7 },
  precision: { days: 3, n: 5, mean: 80.2, rsdPct: 0.6, betweenRsdPct: 0.4 },
});

interface DemoStudy {
  title: string;
  method: string;
  version: number;
  author: string;
  status: StudyStatus;
  data: StudyData;
  meta: StudyMeta;
  createdDaysAgo: number;
  updatedDaysAgo: number;
  submittedDaysAgo?: number;
  approvedDaysAgo?: number;
}

/** The first replicate of the lowest standard reads well off the line: a point a reviewer questions. */
function withLowStandardOffLine(data: StudyData): StudyData {
  const standards = (data.standards as { x: number; y: number }[]).map((point, i) =>
    i === 0 ? { ...point, y: round(point.y * 1.35, 5) } : point,
  );
  return { ...data, standards };
}

function withExcludedStandard(data: StudyData): StudyData {
  const standards = (data.standards as { x: number; y: number }[]).map((point, i) =>
    i === 13
      ? { ...point, y: round(point.y * 1.09, 4), excluded: { reason: 'Air bubble in the sample loop; injection repeated.' } }
      : point,
  );
  return { ...data, standards };
}

function standardsAndBlanksOnly(data: StudyData): StudyData {
  const { model, weighting, standards, blanks } = data;
  return { model, weighting, standards, blanks };
}

const STUDIES: DemoStudy[] = [
  {
    title: DEMO_STUDIES.nitrateInitial,
    method: DEMO_METHODS.nitrate,
    version: 1,
    author: 'analyst2@meritline.test',
    status: 'approved',
    data: studyData(nitrate(416, [0.5, 1, 2.5, 5, 10, 15, 25])),
    meta: {
      instrument: 'IC-1, suppressed conductivity',
      startedOn: isoDay(410),
      finishedOn: isoDay(404),
      conclusion: 'Linear from 0.5 to 25 mg/L; recovery and precision within the criteria.',
    },
    createdDaysAgo: 410,
    updatedDaysAgo: 403,
    submittedDaysAgo: 403,
    approvedDaysAgo: 400,
  },
  {
    title: DEMO_STUDIES.nitrateApproved,
    method: DEMO_METHODS.nitrate,
    version: 2,
    author: 'analyst@meritline.test',
    status: 'approved',
    data: studyData(nitrate(4543, [0.2, 1, 2.5, 5, 10, 25, 50])),
    meta: {
      instrument: 'IC-2, suppressed conductivity',
      startedOn: isoDay(40),
      finishedOn: isoDay(33),
      conclusion:
        'Linear from 0.2 to 50 mg/L with the new column; recovery, precision and the detection limit meet the criteria. Drinking-water results are reported under the laboratory’s procedures after review.',
    },
    createdDaysAgo: 40,
    updatedDaysAgo: 32,
    submittedDaysAgo: 32,
    approvedDaysAgo: 30,
  },
  {
    title: DEMO_STUDIES.dyeSubmitted,
    method: DEMO_METHODS.dye,
    version: 1,
    author: 'analyst@meritline.test',
    status: 'submitted',
    data: studyData(tartrazine),
    meta: {
      instrument: 'UV-Vis 1, 1 cm glass cell',
      startedOn: isoDay(9),
      finishedOn: isoDay(4),
      conclusion: 'All criteria met; fit for the assay of tartrazine in soft drinks.',
    },
    createdDaysAgo: 9,
    updatedDaysAgo: 2,
    submittedDaysAgo: 2,
  },
  {
    title: DEMO_STUDIES.pesticideReturned,
    method: DEMO_METHODS.pesticide,
    version: 1,
    author: 'analyst2@meritline.test',
    status: 'returned',
    data: withLowStandardOffLine(studyData(chlorpyrifos(150))),
    meta: { instrument: 'LC-MS/MS 1, ESI positive', startedOn: isoDay(20), finishedOn: isoDay(12) },
    createdDaysAgo: 20,
    updatedDaysAgo: 6,
    submittedDaysAgo: 8,
  },
  {
    title: DEMO_STUDIES.nitrateDraft,
    method: DEMO_METHODS.nitrate,
    version: 2,
    author: 'analyst2@meritline.test',
    status: 'draft',
    data: withExcludedStandard(studyData(nitrate(777, [0.2, 1, 2.5, 5, 10, 25, 50]))),
    meta: { instrument: 'IC-2, suppressed conductivity', startedOn: isoDay(5) },
    createdDaysAgo: 5,
    updatedDaysAgo: 1,
  },
  {
    title: DEMO_STUDIES.pesticideDraft,
    method: DEMO_METHODS.pesticide,
    version: 1,
    author: 'analyst@meritline.test',
    status: 'draft',
    data: standardsAndBlanksOnly(studyData(chlorpyrifos(2207))),
    meta: { instrument: 'LC-MS/MS 1, ESI positive', startedOn: isoDay(1) },
    createdDaysAgo: 1,
    updatedDaysAgo: 0,
  },
  ...(
    [
      [DEMO_STUDIES.caffeineInitial, 1, caffeine(3301, 12.62, 99.1), 'HPLC-1, variable-wavelength detector', 320, 312],
      [DEMO_STUDIES.caffeineSonication, 2, caffeine(3302, 12.58, 99.9), 'HPLC-1, variable-wavelength detector', 180, 171],
      [DEMO_STUDIES.caffeineDetector, 3, caffeine(3303, 14.51, 100.0), 'HPLC-2, diode-array detector', 52, 44],
    ] as const
  ).map(([title, version, scenario, instrument, started, finished]): DemoStudy => ({
    title,
    method: DEMO_METHODS.caffeine,
    version,
    author: version === 2 ? 'analyst2@meritline.test' : 'analyst@meritline.test',
    status: 'approved',
    data: studyData(scenario),
    meta: {
      instrument,
      startedOn: isoDay(started),
      finishedOn: isoDay(finished),
      conclusion: 'Linearity, recovery and precision meet the assay criteria of the version.',
    },
    createdDaysAgo: started,
    updatedDaysAgo: finished - 1,
    submittedDaysAgo: finished - 1,
    approvedDaysAgo: finished - 3,
  })),
  {
    title: DEMO_STUDIES.dyeAccuracy,
    method: DEMO_METHODS.dye,
    version: 1,
    author: 'analyst@meritline.test',
    status: 'draft',
    data: studyData(tartrazineAccuracy),
    meta: { instrument: 'UV-Vis 1, 1 cm glass cell', startedOn: isoDay(3) },
    createdDaysAgo: 3,
    updatedDaysAgo: 0,
  },
];

function isoDay(days: number): string {
  return daysAgo(days).toISOString().slice(0, 10);
}

export async function seedDemoStudies(manager: EntityManager) {
  const audit = new AuditService(manager.connection);
  const users = await manager.getRepository(User).find();
  const versions = await manager.getRepository(MethodVersion).find({ relations: { method: true } });
  for (const demo of STUDIES) {
    const version = versions.find((v) => v.method.name === demo.method && v.number === demo.version) as MethodVersion;
    const author = users.find((user) => user.email === demo.author) as User;
    const data = withMethodDefaults(demo.data, version, version.method);
    await saveNewStudy(
      manager,
      audit,
      {
        methodVersionId: version.id,
        title: demo.title,
        status: demo.status,
        data,
        ...evaluateStudyData(data),
        meta: demo.meta,
        authorId: author.id,
        editorIds: [author.id],
        copiedFromId: null,
        submittedAt: demo.submittedDaysAgo === undefined ? null : daysAgo(demo.submittedDaysAgo),
        approvedAt: demo.approvedDaysAgo === undefined ? null : daysAgo(demo.approvedDaysAgo),
        createdAt: daysAgo(demo.createdDaysAgo),
        updatedAt: daysAgo(demo.updatedDaysAgo),
      },
      author,
    );
  }
}
