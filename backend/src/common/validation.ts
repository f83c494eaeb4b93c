import { UnprocessableEntityException, ValidationPipe, type ValidationError } from '@nestjs/common';
import type { FieldError } from '@meritline/shared';

function flatten(errors: ValidationError[], parent = ''): FieldError[] {
  return errors.flatMap((error) => {
    const field = parent ? (/^\d+$/.test(error.property) ? `${parent}[${error.property}]` : `${parent}.${error.property}`) : error.property;
    const own = Object.entries(error.constraints ?? {}).map(([code, message]) => ({ field, code, message }));
    return [...own, ...flatten(error.children ?? [], field)];
  });
}

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
