import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { ArrayMaxSize, ArrayMinSize, IsArray, IsIn, IsInt, IsOptional, IsString, IsUUID, MaxLength, Min, MinLength } from 'class-validator';
import { QC_SERIES, type PutQcBaselineRequest, type QcSeries } from '@meritline/shared';

export class QcTrendsQueryDto {
  @ApiProperty({ enum: QC_SERIES })
  @IsIn(QC_SERIES, { message: `Choose one of ${QC_SERIES.join(', ')}.` })
  series: QcSeries;

  @ApiPropertyOptional({ format: 'uuid', description: 'A version of the method; the active version when left out.' })
  @IsOptional()
  @IsUUID('all', { message: 'Choose a method version.' })
  versionId?: string;
}

export class PutQcBaselineDto implements PutQcBaselineRequest {
  @ApiProperty({ type: [String], description: 'Released, accepted runs of the version (3 to 200).' })
  @IsArray({ message: 'Give the baseline runs as a list.' })
  @ArrayMinSize(3, { message: 'A baseline needs at least 3 released runs (common practice is 20 or more).' })
  @ArrayMaxSize(200, { message: 'A baseline holds at most 200 runs.' })
  @IsUUID('all', { each: true, message: 'Each baseline run must be a run id.' })
  runIds: string[];

  @ApiProperty({ description: 'Why these runs describe the method in control (1 to 500 characters).' })
  @IsString()
  @MinLength(1, { message: 'Say why these runs make a good baseline.' })
  @MaxLength(500)
  reason: string;

  @ApiPropertyOptional({ description: 'The lock version of the baseline as loaded; left out for the first baseline.' })
  @IsOptional()
  @IsInt()
  @Min(1)
  lockVersion?: number;
}
