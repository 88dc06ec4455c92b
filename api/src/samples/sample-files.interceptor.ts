import {
  BadRequestException,
  type CallHandler,
  type ExecutionContext,
  HttpException,
  HttpStatus,
  Injectable,
  type NestInterceptor,
  PayloadTooLargeException,
} from '@nestjs/common';
import { FilesInterceptor } from '@nestjs/platform-express';
import { memoryStorage } from 'multer';
import type { Request } from 'express';
import type { Observable } from 'rxjs';
import { AppConfig } from '../config/app-config';
import { sizeLabel } from './sample-ingest';

export const UPLOAD_LENGTH_REQUIRED_MESSAGE =
  'The upload did not say how large it is (no Content-Length). Nothing was stored; upload the files from the form.';

/** Room for the multipart boundaries, part headers and text fields around the files. */
const MULTIPART_ALLOWANCE = 1024 * 1024;

/**
 * Nest's FilesInterceptor for the multipart field `files` (memory storage), built with the limits
 * of the environment (SAMPLE_MAX_FILE_MB, SAMPLE_MAX_FILES), with multer's terse errors
 * ("File too large", "Too many files", "Unexpected field") turned into messages that say what to do.
 * JSON requests pass through untouched (multer skips bodies that are not multipart).
 * An interrupted upload fails here, before anything is stored.
 */
@Injectable()
export class SampleFilesInterceptor implements NestInterceptor {
  private readonly inner: NestInterceptor;
  /** Largest declared Content-Length of a multipart upload. */
  private readonly maxRequestBytes: number;

  constructor(private readonly config: AppConfig) {
    const { maxFileBytes, maxFiles } = config.sampleLimits;
    const Mixin = FilesInterceptor('files', maxFiles, {
      storage: memoryStorage(),
      // Text fields are small (note ≤ 2000 characters); 64 kB each leaves room for UTF-8.
      limits: { fileSize: maxFileBytes, files: maxFiles, fieldSize: 64 * 1024, fields: 20 },
    });
    this.inner = new Mixin();
    // One upload can never hold more than the client may keep, nor more files than allowed.
    this.maxRequestBytes =
      Math.min(config.sampleLimits.maxClientBytes, maxFileBytes * maxFiles) + MULTIPART_ALLOWANCE;
  }

  async intercept(context: ExecutionContext, next: CallHandler): Promise<Observable<unknown>> {
    const request = context.switchToHttp().getRequest<Request>();
    const declared = Number(request.headers['content-length']);
    const multipart = Boolean(request.is('multipart/form-data'));
    if (multipart && request.headers['content-length'] === undefined) {
      // A chunked upload's size is unknown until all of it has arrived: refused unread with 411
      // Length Required (RFC 9110, section 15.5.12). Browsers send the length of a form's files.
      throw new HttpException(UPLOAD_LENGTH_REQUIRED_MESSAGE, HttpStatus.LENGTH_REQUIRED);
    }
    if (multipart && declared > this.maxRequestBytes) {
      // Refused on its declared length, before multer buffers any of it.
      throw new PayloadTooLargeException(
        `The upload is larger than ${sizeLabel(this.maxRequestBytes - MULTIPART_ALLOWANCE)}, the most one upload ` +
          'can hold. Nothing was stored; upload the files in smaller batches.',
      );
    }
    try {
      return await this.inner.intercept(context, next);
    } catch (error) {
      throw this.explain(error);
    }
  }

  private explain(error: unknown): unknown {
    if (!(error instanceof HttpException)) return error;
    const { maxFileBytes, maxFiles } = this.config.sampleLimits;
    const text = error.message;
    if (error instanceof PayloadTooLargeException || /File too large/i.test(text)) {
      return new PayloadTooLargeException(
        `A file is larger than ${sizeLabel(maxFileBytes)}, the limit per file. Nothing was stored; ` +
          'split the text into smaller files.',
      );
    }
    if (/Too many files/i.test(text) || (/Unexpected (file )?field/i.test(text) && /- files$/.test(text))) {
      return new BadRequestException(
        `At most ${maxFiles} files can be uploaded at once. Nothing was stored; upload them in smaller batches.`,
      );
    }
    if (/Unexpected (file )?field/i.test(text)) {
      return new BadRequestException('Send the files in the multipart field "files".');
    }
    if (/^Multipart:/.test(text)) {
      return new BadRequestException('The upload was cut off or malformed. Nothing was stored; try again.');
    }
    return error;
  }
}
