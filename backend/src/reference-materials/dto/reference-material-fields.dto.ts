import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsNumber, IsOptional, IsPositive, Matches, Max, Min } from 'class-validator';
import { CERTIFIED_VALUE_KINDS, type CertifiedValueKind, type ReferenceMaterialFields } from '@meritline/shared';
import { OptionalText, RequiredText } from '../../methods/dto/text.decorators.js';

const DAY = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;
const FINITE = { allowNaN: false, allowInfinity: false };
const MAX_VALUE = 1e12;

export class ReferenceMaterialFieldsDto implements ReferenceMaterialFields {
  @ApiProperty({ example: 'Nitrate stock, sodium nitrate' })
  @RequiredText(160, 'Name the material.')
  name: string;

  @ApiProperty({ example: 'Nitrate' })
  @RequiredText(120, 'Name the analyte.')
  analyte: string;

  @ApiProperty({ example: 'Harbour Chemicals' })
  @RequiredText(160, 'Name the supplier.')
  supplier: string;

  @ApiProperty({ example: 'HC-2291' })
  @RequiredText(80, 'Give the lot number.')
  lot: string;

  @ApiProperty({ example: 'CRM-0042/26' })
  @RequiredText(80, 'Give the certificate number.')
  certificateNumber: string;

  @ApiProperty({
    enum: CERTIFIED_VALUE_KINDS,
    description: 'purity: a mass fraction (g/g) of a pure substance; content: a value in its unit.',
  })
  @IsIn(CERTIFIED_VALUE_KINDS, { message: 'Say whether the certificate gives a purity or a content.' })
  valueKind: CertifiedValueKind;

  @ApiProperty({ example: 0.9995, description: 'A purity is a mass fraction: above 0 and at most 1.' })
  @IsNumber(FINITE, { message: 'Enter the certified value as a number.' })
  @IsPositive({ message: 'The certified value must be greater than zero.' })
  @Max(MAX_VALUE)
  certifiedValue: number;

  @ApiProperty({ example: 'g/g', description: 'g/g for a purity.' })
  @RequiredText(30, 'Give the unit of the certified value.')
  unit: string;

  @ApiPropertyOptional({ nullable: true, example: 0.0004, description: 'Expanded uncertainty U as printed; give k with it.' })
  @IsOptional()
  @IsNumber(FINITE, { message: 'Enter the expanded uncertainty as a number.' })
  @Min(0, { message: 'An uncertainty cannot be negative.' })
  @Max(MAX_VALUE)
  expandedUncertainty?: number | null;

  @ApiPropertyOptional({ nullable: true, example: 2, description: 'Coverage factor k of U.' })
  @IsOptional()
  @IsNumber(FINITE, { message: 'Enter the coverage factor as a number.' })
  @IsPositive({ message: 'The coverage factor must be greater than zero.' })
  @Max(10, { message: 'A coverage factor above 10 is not plausible.' })
  coverageFactor?: number | null;

  @ApiPropertyOptional({ nullable: true, description: 'Standard uncertainty u, when the certificate gives u instead of U and k.' })
  @IsOptional()
  @IsNumber(FINITE, { message: 'Enter the standard uncertainty as a number.' })
  @Min(0, { message: 'An uncertainty cannot be negative.' })
  @Max(MAX_VALUE)
  standardUncertainty?: number | null;

  @ApiProperty({ example: '2026-11-02', format: 'date' })
  @Matches(DAY, { message: 'Give the date received as YYYY-MM-DD.' })
  receivedOn: string;

  @ApiPropertyOptional({ example: '2026-11-10', format: 'date', nullable: true })
  @IsOptional()
  @Matches(DAY, { message: 'Give the date opened as YYYY-MM-DD.' })
  openedOn?: string | null;

  @ApiProperty({ example: '2028-10-31', format: 'date', description: 'Last day of use.' })
  @Matches(DAY, { message: 'Give the expiry date as YYYY-MM-DD.' })
  expiresOn: string;

  @ApiPropertyOptional({ example: 'Desiccator, room temperature, away from light' })
  @OptionalText(500)
  storage?: string;
}

export class LockVersionDto {
  @ApiProperty({ description: 'The lock version read; a stale one answers 409.' })
  @Type(() => Number)
  @IsInt({ message: 'Send the lock version you read.' })
  @Min(1)
  lockVersion: number;
}
