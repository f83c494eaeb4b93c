import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsOptional, IsString, Matches, MaxLength, Min } from 'class-validator';

export class ReturnStudyDto {
  @ApiProperty({ maxLength: 2000, description: 'What the author should change.' })
  @IsString()
  @Matches(/\S/, { message: 'Say what the author should change before resubmitting.' })
  @MaxLength(2000)
  comment: string;

  @ApiPropertyOptional({ description: 'The lock version the reviewer saw; a newer one answers 409.' })
  @IsOptional()
  @IsInt()
  @Min(1)
  lockVersion?: number;
}
