import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsObject, IsOptional, IsString, IsUUID, MaxLength, Min, MinLength } from 'class-validator';

export class CreateRunDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'Choose a method version.' })
  methodVersionId: string;

  @ApiProperty({ example: 'Nitrate in drinking water, batch 2026-12-02' })
  @IsString()
  @MinLength(1, { message: 'Give the run a title.' })
  @MaxLength(200)
  title: string;

  @ApiProperty({
    description:
      'The run in the study format: model, weighting, twoPoint, standards, checks [{ id, nominal, y }], unknowns [{ id, y, dilution }].',
    example: {
      model: 'linear',
      standards: [
        { x: 0.5, y: 0.061 },
        { x: 2, y: 0.242 },
        { x: 5, y: 0.604 },
      ],
      checks: [{ id: 'CCV-1', nominal: 2, y: [0.243] }],
      unknowns: [{ id: 'W-014', y: [0.412, 0.415], dilution: 1 }],
    },
  })
  @IsObject({ message: 'The run data must be an object.' })
  data: Record<string, unknown>;

  @ApiPropertyOptional({ description: 'The lock version of the method version the analyst saw; a changed version answers 409.' })
  @IsOptional()
  @IsInt()
  @Min(1)
  methodVersionLockVersion?: number;
}

export class PreviewRunDto extends CreateRunDto {}
