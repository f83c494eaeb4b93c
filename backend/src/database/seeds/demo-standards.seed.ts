import type { EntityManager } from 'typeorm';
import { todayIso } from '@meritline/shared';
import { AuditService } from '../../audit/audit.service.js';
import { ReferenceMaterial } from '../../reference-materials/reference-material.entity.js';
import { User } from '../../users/user.entity.js';

const day = (offset: number) => todayIso(new Date(Date.now() + offset * 86_400_000));

/** Invented materials of the demo laboratory; dates relative to the seeding day, one of them expiring soon. */
export const DEMO_REFERENCE_MATERIALS = [
  {
    name: 'Cadmium granules, 99.99 %',
    analyte: 'Cadmium',
    supplier: 'Northfield Fine Chemicals',
    lot: 'NF-CD-0917',
    certificateNumber: 'NFC-22/4471',
    valueKind: 'purity' as const,
    certifiedValue: 0.99992,
    unit: 'g/g',
    expandedUncertainty: 0.00012,
    coverageFactor: 2,
    standardUncertainty: null,
    receivedOn: day(-160),
    openedOn: day(-150),
    expiresOn: day(570),
    storage: 'Tightly closed, dry, room temperature.',
  },
  {
    name: 'Sodium nitrate, dried',
    analyte: 'Nitrate',
    supplier: 'Calder Reference Materials',
    lot: 'CRM-NO3-2207',
    certificateNumber: 'CRM-0788',
    valueKind: 'purity' as const,
    certifiedValue: 0.9987,
    unit: 'g/g',
    expandedUncertainty: null,
    coverageFactor: null,
    standardUncertainty: 0.0004,
    receivedOn: day(-700),
    openedOn: day(-420),
    expiresOn: day(18),
    storage: 'Desiccator, room temperature; dry at 105 °C for 2 h before weighing.',
  },
  {
    name: 'Lead solution 1000 mg/L in 2 % nitric acid',
    analyte: 'Lead',
    supplier: 'Calder Reference Materials',
    lot: 'CRM-PB-3310',
    certificateNumber: 'CRM-1104',
    valueKind: 'content' as const,
    certifiedValue: 1001.4,
    unit: 'mg/L',
    expandedUncertainty: 2.6,
    coverageFactor: 2,
    standardUncertainty: null,
    receivedOn: day(-40),
    openedOn: null,
    expiresOn: day(690),
    storage: 'Refrigerated, 2–8 °C.',
  },
];

export async function seedDemoStandards(manager: EntityManager) {
  const audit = new AuditService(manager.connection);
  const owner = await manager.getRepository(User).findOneByOrFail({ email: 'quality@meritline.test' });
  for (const fields of DEMO_REFERENCE_MATERIALS) {
    const material = await manager.save(manager.create(ReferenceMaterial, { ...fields, createdById: owner.id }));
    await audit.record(
      {
        actor: owner,
        action: 'reference-material.created',
        entity: 'reference-material',
        entityId: material.id,
        changes: { name: { from: null, to: material.name }, lot: { from: null, to: material.lot } },
      },
      manager,
    );
  }
}
