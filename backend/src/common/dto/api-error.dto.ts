import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import type { ApiErrorBody, FieldError } from '@meritline/shared';

export class FieldErrorDto implements FieldError {
  @ApiProperty({ example: 'stock.volume' }) field: string;
  @ApiProperty({ example: 'not_positive' }) code: string;
  @ApiProperty({ example: 'Volume of the flask must be greater than zero' }) message: string;
}

/** The one error body of every 4xx answer. */
export class ApiErrorDto implements ApiErrorBody {
  @ApiProperty({ example: 422 }) statusCode: number;
  @ApiProperty() message: string;
  @ApiPropertyOptional({ type: [FieldErrorDto] }) errors?: FieldErrorDto[];
}
