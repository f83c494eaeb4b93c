import { ApiPropertyOptional, PartialType, PickType } from '@nestjs/swagger';
import { IsBoolean, IsOptional } from 'class-validator';
import { CreateInvitationDto } from './create-invitation.dto.js';

export class UpdateUserDto extends PartialType(PickType(CreateInvitationDto, ['name', 'roles'] as const)) {
  @ApiPropertyOptional()
  @IsOptional()
  @IsBoolean()
  active?: boolean;
}
