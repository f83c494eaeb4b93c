import { UnprocessableEntityException, ValidationPipe, type ValidationError } from '@nestjs/common';
import { ValidateIf } from 'class-validator';
import type { FieldError } from '@meritline/shared';

function flatten(errors: ValidationError[], parent = ''): FieldError[] {
  return errors.flatMap((error) => {
    // A key of "" would otherwise name no field at all.
    const name = error.property === '' ? '""' : error.property;
    const field = parent ? (/^\d+$/.test(name) ? `${parent}[${name}]` : `${parent}.${name}`) : name;
    const own = Object.entries(error.constraints ?? {}).map(([code, message]) => ({
      field,
      code,
      message: code === 'whitelistValidation' ? `${field} is not a field of this request; leave it out.` : message,
    }));
    return [...own, ...flatten(error.children ?? [], field)];
  });
}

/** Optional, but null is not "left out": it is checked like any other value (IsOptional would let it through to the service). */
export const IfPresent = () => ValidateIf((_object: unknown, value: unknown) => value !== undefined);

export function unprocessable(errors: FieldError[], message = 'The request has invalid fields.') {
  return new UnprocessableEntityException({ statusCode: 422, message, errors });
}

export const validationPipe = new ValidationPipe({
  whitelist: true,
  forbidNonWhitelisted: true,
  transform: true,
  stopAtFirstError: true,
  exceptionFactory: (errors) => unprocessable(flatten(errors)),
});
