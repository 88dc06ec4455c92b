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
import { BASE_MODEL_FILE, BASE_WORDS_FILE } from '../profile-versions/profile-training';
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
export const BASE_WORDS_GONE_MESSAGE =
  'The base vocabulary this version was trained with is no longer on this server.';

const gzipAsync = promisify(gzip);

/** A gzip download: the bytes sent, their strong ETag and the size once unpacked. */
export type GzipDownload = { gzip: Buffer; etag: string; uncompressedBytes: number };

/** A base file's download: the gzip, with its own sha256 as ETag. */
export type BaseDownload = GzipDownload & { sha256: string };

/**
 * A version's model download, plus the sha256 of the base model and of the base vocabulary it
 * needs (or null).
 */
export type VersionModelDownload = GzipDownload & {
  baseModelSha256: string | null;
  baseWordsSha256: string | null;
};

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

/**
 * A base file (model or vocabulary) read and gzipped once, on the first request, then kept in
 * memory; its ETag is its own hash (the name versions refer to it by). A missing file (corpora not
 * built yet) is 404 and is read again on the next request.
 */
class BaseFileCache {
  private loaded: Promise<BaseDownload> | null = null;

  constructor(
    private readonly file: string,
    private readonly goneMessage: string,
  ) {}

  load(): Promise<BaseDownload> {
    this.loaded ??= readFile(this.file)
      .then(async (bytes) => {
        const sha256 = sha256Hex(bytes);
        return { ...(await gzipDeterministic(bytes)), etag: `"${sha256}"`, sha256 };
      })
      .catch((error: unknown) => {
        this.loaded = null;
        if ((error as { code?: unknown }).code === 'ENOENT') throw new NotFoundException(this.goneMessage);
        throw error;
      });
    return this.loaded;
  }

  /** The download when `sha256` is the file's hash; 404 for any other hash. */
  async byHash(sha256: string): Promise<BaseDownload> {
    const base = await this.load();
    if (sha256.toLowerCase() !== base.sha256) throw new NotFoundException(this.goneMessage);
    return base;
  }

  /** The file's hash, or null when the file is missing. */
  async sha256(): Promise<string | null> {
    try {
      return (await this.load()).sha256;
    } catch (error) {
      if (error instanceof NotFoundException) return null;
      throw error;
    }
  }
}

/**
 * The test keyboard's downloads: a version's model and the base model and base vocabulary it was
 * trained beside.
 */
@Injectable()
export class ModelDownloadService {
  private readonly versionCache = new Map<string, VersionModelDownload>();
  private readonly base = new BaseFileCache(BASE_MODEL_FILE, BASE_MODEL_GONE_MESSAGE);
  private readonly baseWordsFile = new BaseFileCache(BASE_WORDS_FILE, BASE_WORDS_GONE_MESSAGE);

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
        .addSelect('v.wordModel')
        .where('v.id = :id', { id })
        .getOne();
      if (!withModel?.model) throw new ConflictException(MODEL_NOT_READY_MESSAGE);
      withModel.client = row.client;
      const file = writeProfileFile(
        profileFileHeader(withModel, 'as-trained'),
        new Uint8Array(withModel.model),
        undefined,
        withModel.wordModel ? new Uint8Array(withModel.wordModel) : null,
      );
      download = {
        ...(await gzipDeterministic(file)),
        baseModelSha256: withModel.baseModelSha256,
        baseWordsSha256: await this.baseWordsFor(withModel),
      };
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
  baseModel(sha256: string): Promise<BaseDownload> {
    return this.base.byHash(sha256);
  }

  /** The base vocabulary file (corpora/.cache/base-words.bin), as baseModel. */
  baseWords(sha256: string): Promise<BaseDownload> {
    return this.baseWordsFile.byHash(sha256);
  }

  /**
   * The base vocabulary the keyboard loads beside a version: the one it was trained with; for a
   * version trained before the word-aware list but with the base model, this server's (its list
   * then offers the base's words); none without a base model.
   */
  private async baseWordsFor(version: ProfileVersion): Promise<string | null> {
    if (version.baseWordsSha256) return version.baseWordsSha256;
    if (!version.baseModelSha256 || version.wordModel) return null;
    return this.baseWordsFile.sha256();
  }
}
