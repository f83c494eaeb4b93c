import { ApiProperty, IntersectionType } from '@nestjs/swagger';
import type { WithdrawReferenceMaterialRequest } from '@meritline/shared';
import { RequiredText } from '../../methods/dto/text.decorators.js';
import { LockVersionDto } from './reference-material-fields.dto.js';

class WithdrawReasonDto {
  @ApiProperty({ example: 'Container cracked; contents possibly contaminated.' })
  @RequiredText(1000, 'Say why the material is withdrawn.')
  reason: string;
}

export class WithdrawReferenceMaterialDto
  extends IntersectionType(WithdrawReasonDto, LockVersionDto)
  implements WithdrawReferenceMaterialRequest {}
