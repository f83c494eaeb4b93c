import { applyDecorators } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiCookieAuth,
  ApiExtraModels,
  ApiOkResponse,
  ApiProduces,
  ApiResponse,
  getSchemaPath,
  type ApiPropertyOptions,
} from '@nestjs/swagger';
import { SESSION_COOKIE } from '../../auth/session-cookie.js';
import { ApiErrorDto } from '../dto/api-error.dto.js';

/** A refusal with the one error body, as JSON even on routes that answer a file. */
export function ApiRefusal(status: number, description: string) {
  return applyDecorators(
    ApiExtraModels(ApiErrorDto),
    ApiResponse({ status, description, content: { 'application/json': { schema: { $ref: getSchemaPath(ApiErrorDto) } } } }),
  );
}

/** Every route is throttled; the sign-in and upload routes more tightly. */
export const ApiThrottled = () => ApiRefusal(429, 'Too many requests; wait a minute and try again.');

/** A route for a signed-in user (on a controller: every route of it). */
export function ApiSignedIn(forbidden = 'The caller’s role may not do this.') {
  return applyDecorators(
    ApiBearerAuth(),
    ApiCookieAuth(SESSION_COOKIE),
    ApiRefusal(401, 'Not signed in, or the session has ended.'),
    ApiRefusal(403, forbidden),
    ApiThrottled(),
  );
}

/** A route addressed by the id of a record. */
export function ApiRecord(what = 'record') {
  return applyDecorators(ApiRefusal(400, 'The id is not a UUID.'), ApiRefusal(404, `No such ${what}.`));
}

/** A route that validates its body or query: one entry per refused field, nothing saved. */
export const ApiInvalid = (
  description = 'Invalid fields: { statusCode, message, errors: [{ field, code, message }] }; nothing is saved.',
) => ApiRefusal(422, description);

export const ApiConflict = (description = 'Someone changed the record since it was loaded (stale lock version); nothing is saved.') =>
  ApiRefusal(409, description);

/** A change to an existing record under optimistic locking. */
export const ApiChange = (what = 'record', conflict?: string) => applyDecorators(ApiRecord(what), ApiInvalid(), ApiConflict(conflict));

export const ApiPasswordRefused = () => ApiRefusal(401, 'Not signed in, or the password is not correct (nothing is signed).');

/** An electronic signature on a record: the signer re-enters the password and names the lock version seen. */
export const ApiSignature = (what = 'record') =>
  applyDecorators(
    ApiPasswordRefused(),
    ApiRecord(what),
    ApiInvalid(),
    ApiConflict('The record changed since it was loaded, or its state does not allow this step; nothing is signed.'),
  );

/** A file answer (PDF, CSV, workbook) in the media types given. */
export function ApiFile(description: string, ...mediaTypes: string[]) {
  return applyDecorators(ApiProduces(...mediaTypes), ApiOkResponse({ description, schema: { type: 'string', format: 'binary' } }));
}

/** A nested part described in words: its shape is the shared type the property is declared with. */
export const described = (description: string, extra: ApiPropertyOptions = {}) =>
  ({ type: 'object', additionalProperties: true, description, ...extra }) as ApiPropertyOptions;
export const describedList = (description: string) =>
  ({ type: 'array', items: { type: 'object', additionalProperties: true }, description }) as ApiPropertyOptions;
