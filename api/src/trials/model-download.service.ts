import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { writeProfileFile } from '@keyloom/shared';
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { BASE_MODEL_FILE } from '../profile-versions/profile-training';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import {
  profileFileHeader,
  ProfileVersionsService,
  VERSION_NOT_FOUND_MESSAGE,
  WITH_MODEL,
} from '../profile-versions/profile-versions.service';

export const MODEL_NOT_READY_MESSAGE = 'This version has no trained model yet.';
export const BASE_MODEL_GONE_MESSAGE =
  'The base model this version was trained with is no longer on this server.';

const gzipAsync = promisify(gzip);

/** A gzip download: the bytes sent, their strong ETag and the size once unpacked. */
export type GzipDownload = { gzip: Buffer; etag: string; uncompressedBytes: number };

/** A version's model download, plus the sha256 of the base model it needs (or null). */
export type VersionModelDownload = GzipDownload & { baseModelSha256: string | null };

/**
 * gzip level 9. Node writes no file name and a zero mtime into the gzip header, so the same input
 * gives the same bytes every time (and so a stable ETag).
 */
export async function gzipDeterministic(bytes: Uint8Array): Promise<GzipDownload> {
  const out = await gzipAsync(bytes, { level: 9 });
  return { gzip: out, etag: `"${sha256Hex(out)}"`, uncompressedBytes: bytes.length };
}

export function sha256Hex(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/**
 * Whether an If-None-Match header names `etag` (RFC 9110 §13.1.2: weak comparison, `*` matches any).
 * @param header the raw header, possibly a comma-separated list; undefined when absent
 */
export function etagMatches(header: string | undefined, etag: string): boolean {
  if (!header) return false;
  const bare = (tag: string) => tag.trim().replace(/^W\//, '');
  return header.split(',').some((tag) => tag.trim() === '*' || bare(tag) === bare(etag));
}

// Versions' downloads kept in memory (a trained model never changes); a few are enough for a clinic.
const VERSION_CACHE_SIZE = 16;

/** The test keyboard's downloads: a version's model and the base model it was trained beside. */
@Injectable()
export class ModelDownloadService {
  private readonly versionCache = new Map<string, VersionModelDownload>();
  private base: Promise<GzipDownload & { sha256: string }> | null = null;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly versions: ProfileVersionsService,
    private readonly audit: AuditService,
  ) {}

  /**
   * The version's .klprofile (header as at training time), gzipped. Readers of the version; 409
   * without a model. `ifNoneMatch` matching → `{ notModified: etag }` and nothing is audited.
   */
  async versionModel(
    actor: Actor,
    id: string,
    ifNoneMatch: string | undefined,
  ): Promise<VersionModelDownload | { notModified: string }> {
    const { clientId } = await this.versions.readable(actor, id);
    const row = await this.dataSource
      .getRepository(ProfileVersion)
      .createQueryBuilder('v')
      .leftJoinAndSelect('v.client', 'client')
      .where('v.id = :id', { id })
      .getOne();
    if (!row) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
    if (!WITH_MODEL.includes(row.status) || row.modelSize === null) {
      throw new ConflictException(MODEL_NOT_READY_MESSAGE);
    }
    // The pseudonym is in the header and may be renamed: part of the key.
    const key = `${id}|${row.client?.pseudonym ?? ''}`;
    let download = this.versionCache.get(key);
    if (!download) {
      const withModel = await this.dataSource
        .getRepository(ProfileVersion)
        .createQueryBuilder('v')
        .addSelect('v.model')
        .where('v.id = :id', { id })
        .getOne();
      if (!withModel?.model) throw new ConflictException(MODEL_NOT_READY_MESSAGE);
      withModel.client = row.client;
      const file = writeProfileFile(
        profileFileHeader(withModel, 'as-trained'),
        new Uint8Array(withModel.model),
      );
      download = { ...(await gzipDeterministic(file)), baseModelSha256: withModel.baseModelSha256 };
      if (this.versionCache.size >= VERSION_CACHE_SIZE) {
        const oldest = this.versionCache.keys().next().value;
        if (oldest !== undefined) this.versionCache.delete(oldest);
      }
      this.versionCache.set(key, download);
    }
    if (etagMatches(ifNoneMatch, download.etag)) return { notModified: download.etag };
    await this.audit.record(
      actor,
      'profile.model-download',
      { type: 'profile-version', id, clientId },
      { number: row.number, bytes: download.gzip.length, uncompressedBytes: download.uncompressedBytes },
    );
    return download;
  }

  /**
   * The base model file (corpora/.cache/base-model.bin) gzipped, when `sha256` is the file's hash;
   * read and packed once, on the first request, then kept in memory. 404 for any other hash.
   */
  async baseModel(sha256: string): Promise<GzipDownload & { sha256: string }> {
    const base = await this.loadBase();
    if (sha256.toLowerCase() !== base.sha256) throw new NotFoundException(BASE_MODEL_GONE_MESSAGE);
    return base;
  }

  private loadBase(): Promise<GzipDownload & { sha256: string }> {
    this.base ??= readFile(BASE_MODEL_FILE)
      .then(async (bytes) => {
        const sha256 = sha256Hex(bytes);
        // The base model's ETag is its own hash (the name the version refers to it by).
        return { ...(await gzipDeterministic(bytes)), etag: `"${sha256}"`, sha256 };
      })
      .catch((error: unknown) => {
        // A missing file (corpora not built yet) is retried on the next request.
        this.base = null;
        if ((error as { code?: unknown }).code === 'ENOENT')
          throw new NotFoundException(BASE_MODEL_GONE_MESSAGE);
        throw error;
      });
    return this.base;
  }
}
