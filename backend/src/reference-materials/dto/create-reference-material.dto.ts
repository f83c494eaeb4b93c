import { ReferenceMaterialFieldsDto } from './reference-material-fields.dto.js';

export class CreateReferenceMaterialDto extends ReferenceMaterialFieldsDto {}
