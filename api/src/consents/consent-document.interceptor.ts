import {
  BadRequestException,
  type CallHandler,
  type ExecutionContext,
  HttpException,
  Injectable,
  type NestInterceptor,
  PayloadTooLargeException,
} from '@nestjs/common';
import { catchError, type Observable, throwError } from 'rxjs';

/** Largest consent form accepted (a scanned page or two; phone photos are 2–5 MB). */
export const MAX_CONSENT_DOCUMENT_BYTES = 10 * 1024 * 1024;
export const DOCUMENT_TOO_LARGE_MESSAGE =
  'The consent form is larger than 10 MB. Scan it at a lower resolution, or save it as a PDF, and try again.';
export const DOCUMENT_FIELD_MESSAGE =
  'Send one consent form (PDF, PNG or JPEG) in the multipart field "file".';

/**
 * Wraps Nest's FileInterceptor (listed after this one) so multer's terse errors ("File too large",
 * "Unexpected field") reach the user as sentences that say what to do.
 */
@Injectable()
export class ConsentDocumentErrors implements NestInterceptor {
  intercept(_context: ExecutionContext, next: CallHandler): Observable<unknown> {
    return next.handle().pipe(
      catchError((error: unknown) => {
        if (error instanceof PayloadTooLargeException) {
          return throwError(() => new PayloadTooLargeException(DOCUMENT_TOO_LARGE_MESSAGE));
        }
        if (error instanceof BadRequestException && isMulterFieldError(error)) {
          return throwError(() => new BadRequestException(DOCUMENT_FIELD_MESSAGE));
        }
        return throwError(() => error);
      }),
    );
  }
}

// Nest maps multer's field errors to BadRequestException with multer's own message.
function isMulterFieldError(error: HttpException): boolean {
  return /Unexpected (file )?field|Too many files|Too many parts|Multipart: Boundary not found/i.test(
    error.message,
  );
}
