import { applyDecorators, HttpCode, Post, type Type } from '@nestjs/common';
import { ApiOkResponse } from '@nestjs/swagger';
import type { Role } from '@meritline/shared';
import { ApiSignature } from '../openapi/api-responses.js';
import { Roles } from './roles.decorator.js';

/** A step of a record's review that the caller signs with the password: answered 200 with where the record now stands. */
export function SigningStep(path: string, what: string, answer: Type, roles: Role[], description?: string) {
  return applyDecorators(Post(path), HttpCode(200), Roles(...roles), ApiOkResponse({ type: answer, description }), ApiSignature(what));
}
