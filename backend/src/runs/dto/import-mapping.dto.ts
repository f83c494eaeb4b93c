import { ApiProperty } from '@nestjs/swagger';
import { IsInt, IsObject, Min } from 'class-validator';
import type { ImportMappingColumns, PutImportMappingRequest } from '@meritline/shared';

export class PutImportMappingDto implements PutImportMappingRequest {
  @ApiProperty({
    description: 'Column header per field: sampleId, sampleType and response required; replicate, dilution and concentration may be null.',
    example: { sampleId: 'Sample Name', sampleType: 'Type', response: 'Area', replicate: 'Inj', dilution: 'Dil.', concentration: 'Amount' },
  })
  @IsObject({ message: 'Give the mapping as an object of column headers.' })
  columns: ImportMappingColumns;

  @ApiProperty({ description: 'The lock version as loaded: 0 when no mapping is saved yet.' })
  @IsInt()
  @Min(0)
  lockVersion: number;
}
