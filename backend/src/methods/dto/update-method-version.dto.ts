import { ApiProperty, ApiPropertyOptional, PartialType } from '@nestjs/swagger';
import { IsIn, IsInt, IsOptional, Min } from 'class-validator';
import type { MethodVersionStatus } from '@meritline/shared';
import { CreateMethodVersionDto } from './create-method-version.dto.js';

export const VERSION_STATUSES: MethodVersionStatus[] = ['draft', 'active', 'retired'];

export class UpdateMethodVersionDto extends PartialType(CreateMethodVersionDto) {
  @ApiProperty({ description: 'The lockVersion you read; a stale one is refused with 409.' })
  @Min(1)
  @IsInt({ message: 'Send the lockVersion you read.' })
  lockVersion: number;

  @ApiPropertyOptional({ enum: VERSION_STATUSES, description: 'draft → active, active → retired (quality managers and admins).' })
  @IsOptional()
  @IsIn(VERSION_STATUSES, { message: `The status must be one of ${VERSION_STATUSES.join(', ')}.` })
  status?: MethodVersionStatus;
}
