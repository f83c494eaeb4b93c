import { ApiProperty, ApiPropertyOptional, PartialType } from '@nestjs/swagger';
import { IsIn, IsInt, IsOptional, IsString, MaxLength, Min } from 'class-validator';
import { MIN_JUSTIFICATION_LENGTH } from '@meritline/shared';
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

  @ApiPropertyOptional({
    description: `Quality managers only: activate although no approved study covers the revalidation scope, saying why (at least ${MIN_JUSTIFICATION_LENGTH} characters); needs \`password\`.`,
  })
  @IsOptional()
  @IsString()
  @MaxLength(4000)
  activationJustification?: string;

  @ApiPropertyOptional({ description: 'The quality manager re-enters their password to sign an activation with justification.' })
  @IsOptional()
  @IsString()
  @MaxLength(200)
  password?: string;
}
