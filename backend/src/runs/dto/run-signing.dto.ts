import { ApiProperty } from '@nestjs/swagger';
import { IsInt, IsNotEmpty, IsString, Matches, MaxLength, Min } from 'class-validator';
import { CreateRunDto } from './create-run.dto.js';

export class SignRunDto {
  @ApiProperty({ description: 'The signer re-enters their password.' })
  @IsString({ message: 'Enter your password to sign.' })
  @IsNotEmpty({ message: 'Enter your password to sign.' })
  @MaxLength(200)
  password: string;

  @ApiProperty({ description: 'The lock version of the run the signer saw; a newer one answers 409.' })
  @IsInt({ message: 'Give the version of the run you saw.' })
  @Min(1)
  version: number;
}

export class ReturnRunDto extends SignRunDto {
  @ApiProperty({ maxLength: 2000, description: 'What the analyst should check or redo.' })
  @IsString({ message: 'Say why the run is returned.' })
  @Matches(/\S/, { message: 'Say why the run is returned.' })
  @MaxLength(2000)
  comment: string;
}

export class SupersedeRunDto extends CreateRunDto {
  @ApiProperty({ maxLength: 2000, description: 'Why the released run is corrected.' })
  @IsString({ message: 'Say why the released run is corrected.' })
  @Matches(/\S/, { message: 'Say why the released run is corrected.' })
  @MaxLength(2000)
  reason: string;
}
