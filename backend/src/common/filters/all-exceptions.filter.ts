import { Catch, HttpException, HttpStatus, Logger, type ArgumentsHost, type ExceptionFilter } from '@nestjs/common';
import { OptimisticLockVersionMismatchError } from 'typeorm';
import { StudyValidationError, type ApiErrorBody } from '@meritline/shared';
import type { Response } from 'express';

function bodyOf(exception: HttpException): ApiErrorBody {
  const status = exception.getStatus();
  const response = exception.getResponse();
  if (typeof response === 'string') return { statusCode: status, message: response };
  const { message, errors } = response as { message?: string | string[]; errors?: ApiErrorBody['errors'] };
  return {
    statusCode: status,
    message: Array.isArray(message) ? message.join('; ') : (message ?? exception.message),
    ...(errors ? { errors } : {}),
  };
}

/** One body shape for every error: { statusCode, message, errors? }; unknown errors never leak a stack. */
@Catch()
export class AllExceptionsFilter implements ExceptionFilter {
  private readonly logger = new Logger(AllExceptionsFilter.name);

  catch(exception: unknown, host: ArgumentsHost) {
    const response = host.switchToHttp().getResponse<Response>();
    const body = this.toBody(exception);
    if (body.statusCode >= 500) this.logger.error(exception instanceof Error ? exception.stack : String(exception));
    response.status(body.statusCode).json(body);
  }

  private toBody(exception: unknown): ApiErrorBody {
    if (exception instanceof HttpException) return bodyOf(exception);
    if (exception instanceof StudyValidationError) {
      return { statusCode: 422, message: 'The study data are not valid.', errors: exception.errors };
    }
    if (exception instanceof OptimisticLockVersionMismatchError) {
      return { statusCode: 409, message: 'Someone else changed this record; reload it and try again.' };
    }
    const { status, statusCode, type } = (exception ?? {}) as { status?: number; statusCode?: number; type?: string };
    const code = status ?? statusCode;
    if (typeof code === 'number' && code >= 400 && code < 500) {
      const message =
        type === 'entity.parse.failed'
          ? `The request body is not valid JSON: ${(exception as Error).message}`
          : (exception as Error).message;
      return { statusCode: code, message };
    }
    return { statusCode: HttpStatus.INTERNAL_SERVER_ERROR, message: 'Internal server error' };
  }
}
