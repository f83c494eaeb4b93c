import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsNotEmpty, IsOptional, IsString, MaxLength, Min } from 'class-validator';

export class SignStudyDto {
  @ApiProperty({ description: 'The signer re-enters their password.' })
  @IsString()
  @IsNotEmpty({ message: 'Enter your password to sign.' })
  @MaxLength(200)
  password: string;

  @ApiPropertyOptional({ maxLength: 2000 })
  @IsOptional()
  @IsString()
  @MaxLength(2000)
  comment?: string;

  @ApiPropertyOptional({ description: 'The lock version the signer saw; a newer one answers 409.' })
  @IsOptional()
  @IsInt()
  @Min(1)
  lockVersion?: number;
}
