import type { EntityManager } from 'typeorm';
import type { MethodChangeKind, MethodVersionStatus, RevalidationFamily } from '@meritline/shared';
import { AuditService } from '../../audit/audit.service.js';
import { findTemplate, type CriteriaTemplate } from '../../methods/criteria-templates.js';
import { MethodVersion, type CriteriaSet } from '../../methods/method-version.entity.js';
import { Method } from '../../methods/method.entity.js';
import { User } from '../../users/user.entity.js';

export const DEMO_METHODS = {
  nitrate: 'Nitrate in drinking water by ion chromatography',
  dye: 'Tartrazine in soft drinks by UV-Vis spectrophotometry',
  pesticide: 'Chlorpyrifos in apples by LC-MS/MS',
  caffeine: 'Caffeine in energy drinks by HPLC-UV',
} as const;

/** Demo dates relative to the day the database is seeded, so the demo always looks current. */
export const daysAgo = (days: number, hours = 0) => new Date(Date.now() - days * 86_400_000 - hours * 3_600_000);

const template = (key: string) => findTemplate(key) as CriteriaTemplate;

const nitrateCriteria: CriteriaSet = [
  ...template('environmental').criteria,
  { figure: 'detection.epaMdl.mdl', op: '<=', value: 0.1, label: 'Method detection limit (40 CFR 136 App. B) at most 0.1 mg/L' },
];
const pesticideCriteria: CriteriaSet = [
  ...template('residue').criteria,
  { figure: 'detection.sdIntercept.loq', op: '<=', value: 10, label: 'LOQ at most 10 µg/kg, the laboratory’s reporting limit' },
];

interface DemoVersion {
  number: number;
  status: MethodVersionStatus;
  changeSummary: string;
  criteria: CriteriaSet;
  createdBy: string;
  createdDaysAgo: number;
  changeKind?: MethodChangeKind;
  revalidationScope?: RevalidationFamily[];
}

interface DemoMethod extends Pick<Method, 'name' | 'analyte' | 'matrix' | 'technique' | 'xUnit' | 'yUnit' | 'purpose'> {
  createdDaysAgo: number;
  versions: DemoVersion[];
}

const METHODS: DemoMethod[] = [
  {
    name: DEMO_METHODS.nitrate,
    analyte: 'Nitrate (as NO₃⁻)',
    matrix: 'Drinking water',
    technique: 'Ion chromatography, suppressed conductivity',
    xUnit: 'mg/L',
    yUnit: 'µS·min',
    purpose: 'environmental',
    createdDaysAgo: 420,
    versions: [
      {
        number: 1,
        status: 'retired',
        changeSummary: 'First release: 0.5–25 mg/L on the 4 mm anion column.',
        criteria: template('environmental').criteria,
        createdBy: 'quality@meritline.test',
        createdDaysAgo: 420,
      },
      {
        number: 2,
        status: 'active',
        changeSummary:
          'New guard and analytical column (smaller particles); range extended to 0.2–50 mg/L; detection limit by the MDL procedure.',
        criteria: nitrateCriteria,
        createdBy: 'quality@meritline.test',
        createdDaysAgo: 45,
      },
    ],
  },
  {
    name: DEMO_METHODS.dye,
    analyte: 'Tartrazine',
    matrix: 'Soft drinks',
    technique: 'UV-Vis spectrophotometry at 427 nm, 1 cm cell',
    xUnit: 'mg/L',
    yUnit: 'AU',
    purpose: 'assay',
    createdDaysAgo: 90,
    versions: [
      {
        number: 1,
        status: 'active',
        changeSummary: 'First release: 1–12 mg/L after degassing and dilution.',
        criteria: template('assay').criteria,
        createdBy: 'quality@meritline.test',
        createdDaysAgo: 90,
      },
    ],
  },
  {
    name: DEMO_METHODS.pesticide,
    analyte: 'Chlorpyrifos',
    matrix: 'Apples',
    technique: 'LC-MS/MS (ESI positive, MRM) after QuEChERS extraction; matrix-matched standards',
    xUnit: 'µg/kg',
    yUnit: 'area ratio',
    purpose: 'residue',
    createdDaysAgo: 150,
    versions: [
      {
        number: 1,
        status: 'active',
        changeSummary: 'First release: 1–100 µg/kg, 1/x² weighting.',
        criteria: pesticideCriteria,
        createdBy: 'quality@meritline.test',
        createdDaysAgo: 150,
      },
      {
        number: 2,
        status: 'draft',
        changeSummary: 'Proposal: a second MRM transition for confirmation and a lowest standard at 0.5 µg/kg.',
        criteria: pesticideCriteria,
        createdBy: 'analyst@meritline.test',
        createdDaysAgo: 3,
      },
    ],
  },
  {
    name: DEMO_METHODS.caffeine,
    analyte: 'Caffeine',
    matrix: 'Energy drinks',
    technique: 'HPLC-UV at 273 nm, C18 column, isocratic',
    xUnit: 'mg/L',
    yUnit: 'mAU·s',
    purpose: 'assay',
    createdDaysAgo: 330,
    versions: [
      {
        number: 1,
        status: 'retired',
        changeSummary: 'First release: 20–120 mg/L after degassing and a tenfold dilution.',
        criteria: template('assay').criteria,
        createdBy: 'quality@meritline.test',
        createdDaysAgo: 330,
      },
      {
        number: 2,
        status: 'retired',
        changeSummary: 'Degassing by sonication instead of stirring; dilution unchanged.',
        changeKind: 'sample-preparation',
        revalidationScope: ['recovery', 'precision'],
        criteria: template('assay').criteria,
        createdBy: 'analyst@meritline.test',
        createdDaysAgo: 190,
      },
      {
        number: 3,
        status: 'active',
        changeSummary: 'New diode-array detector with a 10 mm flow cell replaces the variable-wavelength detector.',
        changeKind: 'instrument',
        revalidationScope: ['linearity', 'detection-limits', 'precision'],
        criteria: template('assay').criteria,
        createdBy: 'quality@meritline.test',
        createdDaysAgo: 60,
      },
    ],
  },
];

export async function seedDemoMethods(manager: EntityManager) {
  const audit = new AuditService(manager.connection);
  const users = await manager.getRepository(User).find();
  const user = (email: string) => users.find((u) => u.email === email) as User;
  for (const { versions, createdDaysAgo, ...fields } of METHODS) {
    const owner = user('quality@meritline.test');
    const method = await manager.save(
      manager.create(Method, { ...fields, createdById: owner.id, createdAt: daysAgo(createdDaysAgo), updatedAt: daysAgo(createdDaysAgo) }),
    );
    await audit.record(
      { actor: owner, action: 'method.created', entity: 'method', entityId: method.id, changes: { name: { from: null, to: method.name } } },
      manager,
    );
    for (const version of versions) {
      const author = user(version.createdBy);
      const saved = await manager.save(
        manager.create(MethodVersion, {
          methodId: method.id,
          number: version.number,
          status: version.status,
          changeSummary: version.changeSummary,
          changeKind: version.changeKind ?? null,
          revalidationScope: version.revalidationScope ?? null,
          criteria: version.criteria,
          settings: template(fields.purpose).settings,
          createdById: author.id,
          createdAt: daysAgo(version.createdDaysAgo),
        }),
      );
      await audit.record(
        {
          actor: author,
          action: 'method-version.created',
          entity: 'method-version',
          entityId: saved.id,
          changes: { number: { from: null, to: version.number } },
          reason: version.changeSummary,
        },
        manager,
      );
      const statusChanged = (action: 'method-version.activated' | 'method-version.retired', from: string, to: string) =>
        audit.record({ actor: owner, action, entity: 'method-version', entityId: saved.id, changes: { status: { from, to } } }, manager);
      if (version.status !== 'draft') await statusChanged('method-version.activated', 'draft', 'active');
      if (version.status === 'retired') await statusChanged('method-version.retired', 'active', 'retired');
    }
  }
}
