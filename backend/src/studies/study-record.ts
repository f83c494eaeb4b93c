import type { DeepPartial, EntityManager } from 'typeorm';
import { createdFields, type AuditService } from '../audit/audit.service.js';
import { ValidationStudy } from './validation-study.entity.js';

/** Stores a new validation study and its audit entry in the caller's transaction. */
export async function saveNewStudy(
  manager: EntityManager,
  audit: AuditService,
  fields: DeepPartial<ValidationStudy> & { methodVersionId: string },
  actor: { id: string; name: string },
): Promise<ValidationStudy> {
  const study = await manager.save(manager.create(ValidationStudy, fields));
  await audit.record(
    {
      actor,
      action: 'study.created',
      entity: 'study',
      entityId: study.id,
      changes: createdFields({ title: study.title, methodVersionId: fields.methodVersionId, dataHash: study.dataHash }),
    },
    manager,
  );
  return study;
}
