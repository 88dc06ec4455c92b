import {
  type ArgumentsHost,
  Catch,
  type ExceptionFilter,
  HttpException,
  HttpStatus,
  Logger,
} from '@nestjs/common';
import type { ApiError } from '@keyloom/shared';
import type { Response } from 'express';
import { STATUS_CODES } from 'node:http';
import { isBadValueForDatabase, isDatabaseUnavailable } from '../../database/database-errors';

export const DATABASE_DOWN_MESSAGE =
  'The database is not reachable right now; nothing was changed. Try again in a moment.';
export const INVALID_JSON_MESSAGE = 'The request body is not valid JSON.';
export const BAD_VALUE_MESSAGE =
  'A value in the request cannot be stored (a broken character, or a date or number out of range). Nothing was changed.';
const INTERNAL_MESSAGE =
  'Something went wrong on the server. Try again; if it keeps happening, tell an administrator.';

type HttpErrorLike = {
  status?: unknown;
  statusCode?: unknown;
  type?: unknown;
  expose?: unknown;
  message?: unknown;
};

/** Turns any thrown value into the apiErrorSchema body and its status. Pure, so it is unit-tested. */
export function toApiError(exception: unknown): ApiError {
  if (exception instanceof HttpException) {
    const status = exception.getStatus();
    const body = exception.getResponse();
    if (typeof body === 'string') return build(status, body);
    const { message, issues, code } = body as {
      message?: unknown;
      issues?: ApiError['issues'];
      code?: unknown;
    };
    const text = Array.isArray(message)
      ? message.join(' ')
      : typeof message === 'string'
        ? message
        : exception.message;
    const built = build(status, text, issues);
    return typeof code === 'string' ? { ...built, code } : built;
  }
  if (isDatabaseUnavailable(exception)) return build(HttpStatus.SERVICE_UNAVAILABLE, DATABASE_DOWN_MESSAGE);
  // The schemas refuse such values first; this is the last line of defence for one they missed.
  if (isBadValueForDatabase(exception)) return build(HttpStatus.BAD_REQUEST, BAD_VALUE_MESSAGE);

  // Errors raised by Express middleware (body-parser, http-errors) carry a status and a type.
  const e = (typeof exception === 'object' && exception !== null ? exception : {}) as HttpErrorLike;
  if (e.type === 'entity.parse.failed') return build(400, INVALID_JSON_MESSAGE);
  if (e.type === 'entity.too.large') return build(413, 'The request body is too large.');
  const status =
    typeof e.status === 'number' ? e.status : typeof e.statusCode === 'number' ? e.statusCode : 500;
  if (status >= 400 && status < 500 && e.expose === true && typeof e.message === 'string') {
    return build(status, e.message);
  }
  return build(500, INTERNAL_MESSAGE);
}

function build(statusCode: number, message: string, issues?: ApiError['issues']): ApiError {
  const error = STATUS_CODES[statusCode] ?? 'Error';
  return issues ? { statusCode, message, error, issues } : { statusCode, message, error };
}

/** Whole seconds to wait, from an HttpException whose body carries `retryAfterSeconds`. */
function retryAfterSeconds(exception: unknown): number | undefined {
  if (!(exception instanceof HttpException)) return undefined;
  const body = exception.getResponse() as { retryAfterSeconds?: unknown };
  const value = typeof body === 'object' ? body.retryAfterSeconds : undefined;
  return typeof value === 'number' && Number.isFinite(value) ? Math.ceil(value) : undefined;
}

/** Global filter: every error leaves the API as JSON `{statusCode, message, error, issues?}`. */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('ApiError');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const body = toApiError(exception);
    if (body.statusCode >= 500) {
      if (body.statusCode === 503) this.logger.warn(`Database unreachable: ${String(exception)}`);
      else
        this.logger.error(
          exception instanceof Error ? (exception.stack ?? exception.message) : String(exception),
        );
    }
    if (res.headersSent) return;
    const retryAfter = retryAfterSeconds(exception);
    if (retryAfter !== undefined) res.setHeader('Retry-After', String(retryAfter));
    res.status(body.statusCode).json(body);
  }
}
