import { IntersectionType, PartialType } from '@nestjs/swagger';
import type { UpdateReferenceMaterialRequest } from '@meritline/shared';
import { LockVersionDto, ReferenceMaterialFieldsDto } from './reference-material-fields.dto.js';

export class UpdateReferenceMaterialDto
  extends IntersectionType(PartialType(ReferenceMaterialFieldsDto), LockVersionDto)
  implements UpdateReferenceMaterialRequest {}
