import { applyDecorators } from '@nestjs/common';
import { Transform } from 'class-transformer';
import { IsOptional, IsString, MaxLength, MinLength } from 'class-validator';

const trim = Transform(({ value }) => (typeof value === 'string' ? value.trim() : value));

/** A trimmed, non-empty text of at most `max` characters. */
export const RequiredText = (max: number, emptyMessage = 'Fill in this field.') =>
  applyDecorators(trim, IsString(), MinLength(1, { message: emptyMessage }), MaxLength(max));

export const OptionalText = (max: number) => applyDecorators(IsOptional(), trim, IsString(), MaxLength(max));
