import { Controller, Get, Headers, Param, ParseUUIDPipe, Res } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import type { Actor } from '../auth/session-user';
import {
  type BaseDownload,
  type GzipDownload,
  etagMatches,
  ModelDownloadService,
} from './model-download.service';

/** Header with the size of the download once gunzipped (the browser reports it). */
export const UNCOMPRESSED_BYTES_HEADER = 'X-Keyloom-Uncompressed-Bytes';
/** Header naming the base model a version needs: its sha256, or `none`. */
export const BASE_MODEL_HEADER = 'X-Keyloom-Base-Model';
/** Header naming the base vocabulary the keyboard loads beside a version: its sha256, or `none`. */
export const BASE_WORDS_HEADER = 'X-Keyloom-Base-Words';

function sendGzip(
  res: Response,
  download: GzipDownload,
  cacheControl: string,
  extra: Record<string, string>,
): void {
  res
    .status(200)
    .set({
      'Content-Type': 'application/octet-stream',
      'Content-Length': String(download.gzip.length),
      'Cache-Control': cacheControl,
      ETag: download.etag,
      [UNCOMPRESSED_BYTES_HEADER]: String(download.uncompressedBytes),
      ...extra,
    })
    .end(download.gzip);
}

function notModified(res: Response, etag: string, cacheControl: string): void {
  res.status(304).set({ ETag: etag, 'Cache-Control': cacheControl }).end();
}

const VERSION_CACHE = 'private, no-cache';
const BASE_CACHE = 'private, max-age=31536000, immutable';

@ApiTags('test keyboard')
@Controller()
export class ModelDownloadController {
  constructor(private readonly downloads: ModelDownloadService) {}

  @Get('profile-versions/:id/model')
  @ApiOperation({
    summary: 'The version’s model for the test keyboard: a gzipped .klprofile file',
    description:
      'Owning clinician, assigned carer, supervisor (admin 403; a client out of sight 404). No model yet: 409. ' +
      'The bytes never change for a version: ETag is the sha256 of the gzip bytes; If-None-Match → 304. ' +
      `${UNCOMPRESSED_BYTES_HEADER}: size of the .klprofile; ${BASE_MODEL_HEADER}: the base model's sha256 or "none"; ` +
      `${BASE_WORDS_HEADER}: the base vocabulary's sha256 or "none".`,
  })
  @ApiProduces('application/octet-stream')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  async versionModel(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Headers('if-none-match') ifNoneMatch: string | undefined,
    @Res() res: Response,
  ): Promise<void> {
    const download = await this.downloads.versionModel(actor, id, ifNoneMatch);
    if ('notModified' in download) {
      notModified(res, download.notModified, VERSION_CACHE);
      return;
    }
    sendGzip(res, download, VERSION_CACHE, {
      [BASE_MODEL_HEADER]: download.baseModelSha256 ?? 'none',
      [BASE_WORDS_HEADER]: download.baseWordsSha256 ?? 'none',
    });
  }

  @Get('base-models/:sha256')
  @ApiOperation({
    summary: 'The base model (gzip) a version was trained beside, by its sha256',
    description:
      'Any signed-in user. Cached for a year (immutable; ETag is the sha256). A hash other than the ' +
      'server’s current base model: 404.',
  })
  @ApiProduces('application/octet-stream')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  async baseModel(
    @Param('sha256') sha256: string,
    @Headers('if-none-match') ifNoneMatch: string | undefined,
    @Res() res: Response,
  ): Promise<void> {
    sendBase(res, await this.downloads.baseModel(sha256), ifNoneMatch, BASE_MODEL_HEADER);
  }

  @Get('base-words/:sha256')
  @ApiOperation({
    summary: 'The base vocabulary (gzip) the test keyboard offers words from, by its sha256',
    description:
      'Any signed-in user. Cached for a year (immutable; ETag is the sha256). A hash other than the ' +
      `server’s current base vocabulary: 404. The version's model download names it in ${BASE_WORDS_HEADER}.`,
  })
  @ApiProduces('application/octet-stream')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  async baseWords(
    @Param('sha256') sha256: string,
    @Headers('if-none-match') ifNoneMatch: string | undefined,
    @Res() res: Response,
  ): Promise<void> {
    sendBase(res, await this.downloads.baseWords(sha256), ifNoneMatch, BASE_WORDS_HEADER);
  }
}

/** A base file's answer: 304 when the browser has it, else the gzip, cached for a year. */
function sendBase(
  res: Response,
  download: BaseDownload,
  ifNoneMatch: string | undefined,
  header: string,
): void {
  if (etagMatches(ifNoneMatch, download.etag)) {
    notModified(res, download.etag, BASE_CACHE);
    return;
  }
  sendGzip(res, download, BASE_CACHE, { [header]: download.sha256 });
}
