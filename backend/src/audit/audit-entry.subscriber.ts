import { EventSubscriber, type EntitySubscriberInterface } from 'typeorm';
import { AuditEntry } from './audit-entry.entity.js';

export class AuditTrailIsAppendOnlyError extends Error {
  constructor() {
    super('Audit entries are append-only: they cannot be changed or deleted.');
  }
}

@EventSubscriber()
export class AuditEntrySubscriber implements EntitySubscriberInterface<AuditEntry> {
  listenTo() {
    return AuditEntry;
  }

  beforeUpdate(): never {
    throw new AuditTrailIsAppendOnlyError();
  }

  beforeRemove(): never {
    throw new AuditTrailIsAppendOnlyError();
  }

  beforeSoftRemove(): never {
    throw new AuditTrailIsAppendOnlyError();
  }
}
