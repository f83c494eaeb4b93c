import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsNumber, IsOptional, IsPositive, IsUUID, Max } from 'class-validator';

export class CompareVersionsQueryDto {
  @ApiProperty({ format: 'uuid', description: 'The earlier method version.' })
  @IsUUID('all', { message: 'from must name a method version' })
  from: string;

  @ApiProperty({ format: 'uuid', description: 'The later method version.' })
  @IsUUID('all', { message: 'to must name a method version' })
  to: string;

  @ApiPropertyOptional({ format: 'uuid', description: 'A study of the earlier version; default its latest approved study.' })
  @IsOptional()
  @IsUUID('all', { message: 'fromStudy must name a study' })
  fromStudy?: string;

  @ApiPropertyOptional({ format: 'uuid', description: 'A study of the later version; default its latest approved study.' })
  @IsOptional()
  @IsUUID('all', { message: 'toStudy must name a study' })
  toStudy?: string;

  @ApiPropertyOptional({
    description: 'Equivalence margin of the mean recoveries in percentage points; default the later version’s (5 unless set).',
    minimum: 0,
    exclusiveMinimum: true,
    maximum: 50,
  })
  @IsOptional()
  @Type(() => Number)
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'margin must be a number of percentage points' })
  @IsPositive({ message: 'margin must be greater than 0 percentage points' })
  @Max(50, { message: 'margin must be at most 50 percentage points' })
  margin?: number;
}
