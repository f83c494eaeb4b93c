import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';

export const EXPORT_FORMATS = ['csv', 'xlsx'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export class ExportRunQueryDto {
  @ApiProperty({ enum: EXPORT_FORMATS })
  @IsIn(EXPORT_FORMATS, { message: 'Export as csv or xlsx.' })
  format: ExportFormat;
}
