import { ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  type ClientVocabulary,
  type MisspellingCandidate,
  type MisspellingList,
  misspellingCandidates,
  profileSettingsSchema,
  type VocabularyDocument,
  type VocabularyEntry,
  type VocabularyPage,
  type VocabularyQuery,
  vocabularyCsv,
  vocabularyOf,
  vocabularyRows,
  vocabularyText,
  type VocabularyWord,
  type WordPair,
  wordKey,
  wordPairsCsv,
  wordPairsOf,
} from '@keyloom/shared';
import { DataSource, In } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { WRONG_ROLE_MESSAGE } from '../auth/session-user';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import {
  ProfileVersionsService,
  VERSION_NOT_FOUND_MESSAGE,
} from '../profile-versions/profile-versions.service';
import { Sample } from '../samples/sample.entity';
import { BaseVocabularyLoader } from './base-vocabulary';
import { listingPage, listingWords, type SampleDates } from './vocabulary-page';
import { currentClientVocabulary } from './vocabulary.service';

/** Versions whose computed listing is kept in memory (a version never changes; common practice, no source). */
export const LISTING_CACHE_SIZE = 8;

/**
 * UTF-8 byte order mark at the start of the CSV files: spreadsheet programs on Windows read a CSV
 * without it in the local code page and garble every non-ASCII letter; RFC 4180 readers and
 * csv-parse (`bom: true`) skip it. The plain-text list has none (one word per line for devices).
 */
export const CSV_BOM = '\uFEFF';

/** The export formats: route file part, content type, audit name. */
export const VOCABULARY_FILES = {
  csv: { file: 'vocabulary.csv', type: 'text/csv; charset=utf-8' },
  txt: { file: 'vocabulary.txt', type: 'text/plain; charset=utf-8' },
  pairs: { file: 'word-pairs.csv', type: 'text/csv; charset=utf-8' },
} as const;
export type VocabularyFileFormat = keyof typeof VOCABULARY_FILES;

/** One export: the file's text, content type and download name. */
export type VocabularyFile = { body: string; type: string; fileName: string };

/** What one version's listing is computed from and to (kept in the LRU). */
type Listing = {
  clientId: string;
  number: number;
  caseFold: boolean;
  vocabulary: ClientVocabulary;
  documents: VocabularyDocument[];
  titles: Map<string, string>;
  entries: VocabularyEntry[];
  words: VocabularyWord[];
  pairs?: WordPair[];
  misspellings?: MisspellingCandidate[];
};

/** YYYY-MM-DD of a date column or a timestamp (null stays null). */
function day(value: string | Date | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  return typeof value === 'string' ? value.slice(0, 10) : value.toISOString().slice(0, 10);
}

/**
 * A version's vocabulary: the listing (GET /api/profile-versions/:id/vocabulary), the misspelling
 * review and the exports, computed from the version's frozen samples and settings. Owning clinician
 * and supervisor; carers and admins 403; a version out of sight 404.
 */
@Injectable()
export class VersionVocabularyService {
  private readonly cache = new Map<string, Listing>();
  private readonly base = new BaseVocabularyLoader();

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly versions: ProfileVersionsService,
    private readonly audit: AuditService,
  ) {}

  async page(actor: Actor, id: string, query: VocabularyQuery): Promise<VocabularyPage> {
    const listing = await this.listing(actor, id);
    return { versionId: id, ...listingPage(listing.words, query) };
  }

  /**
   * Words of the version that look like misspellings of a much commoner base word, without the keys
   * the client's CURRENT list blocks or keeps.
   */
  async misspellings(actor: Actor, id: string): Promise<MisspellingList> {
    const listing = await this.listing(actor, id);
    const base = await this.base.load();
    listing.misspellings ??= misspellingCandidates(
      listing.entries.map((e) => ({ key: e.key, count: e.count, form: e.form })),
      base.index(),
    );
    const current = await currentClientVocabulary(this.dataSource.manager, listing.clientId);
    const skip = new Set([
      ...current.vocabulary.blocks.map((b) => wordKey(b.word)),
      ...current.keptSpellings.map((k) => wordKey(k)),
    ]);
    const forms = new Map(listing.entries.map((e) => [e.key, e.form]));
    return {
      versionId: id,
      candidates: listing.misspellings
        .filter((c) => !skip.has(c.key))
        .map((c) => ({
          key: c.key,
          word: forms.get(c.key) ?? c.key,
          count: c.count,
          corrections: c.corrections.map((x) => ({
            word: x.word,
            distance: x.distance,
            perMillion: x.frequency,
          })),
        })),
    };
  }

  /**
   * What a device should offer, as a file: blocked words left out (and word pairs holding one),
   * additions in with source "added". Audited with the format and the row count only.
   */
  async export(actor: Actor, id: string, format: VocabularyFileFormat): Promise<VocabularyFile> {
    const listing = await this.listing(actor, id);
    const blocked = new Set(listing.vocabulary.blocks.map((b) => wordKey(b.word)));
    let body: string;
    let rows: number;
    if (format === 'pairs') {
      listing.pairs ??= wordPairsOf(listing.documents, { caseFold: listing.caseFold });
      const pairs = listing.pairs.filter(
        (p) => !blocked.has(wordKey(p.previous)) && !blocked.has(wordKey(p.word)),
      );
      body = CSV_BOM + wordPairsCsv(pairs);
      rows = pairs.length;
    } else {
      const offered = vocabularyRows(
        listing.entries.filter((e) => !blocked.has(e.key)),
        (doc) => listing.titles.get(doc) ?? '',
        listing.vocabulary.additions,
      );
      body = format === 'csv' ? CSV_BOM + vocabularyCsv(offered) : vocabularyText(offered);
      rows = offered.length;
    }
    const { file, type } = VOCABULARY_FILES[format];
    await this.audit.record(
      actor,
      'vocabulary.export',
      { type: 'profile-version', id, clientId: listing.clientId },
      { number: listing.number, format: file, rows },
    );
    // No client name in the file name: a download folder is not a client record.
    return { body, type, fileName: `keyloom-v${listing.number}-${file}` };
  }

  /** The version's computed listing (from the LRU when there), after the access check. */
  private async listing(actor: Actor, id: string): Promise<Listing> {
    await this.versions.readable(actor, id);
    if (actor.role !== 'clinician' && actor.role !== 'supervisor') {
      throw new ForbiddenException(WRONG_ROLE_MESSAGE);
    }
    const hit = this.cache.get(id);
    if (hit) {
      // Most recently used last: the first key is the one to drop.
      this.cache.delete(id);
      this.cache.set(id, hit);
      return hit;
    }
    const listing = await this.compute(id);
    if (this.cache.size >= LISTING_CACHE_SIZE) {
      const oldest = this.cache.keys().next().value;
      if (oldest !== undefined) this.cache.delete(oldest);
    }
    this.cache.set(id, listing);
    return listing;
  }

  private async compute(id: string): Promise<Listing> {
    const version = await this.dataSource.getRepository(ProfileVersion).findOne({
      where: { id },
      select: ['id', 'clientId', 'number', 'settings', 'samples'],
    });
    if (!version) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
    const settings = profileSettingsSchema.parse(version.settings);
    const rows = await this.dataSource.getRepository(Sample).find({
      where: { id: In(version.samples.map((s) => s.id)) },
      select: ['id', 'periodStart', 'periodEnd', 'createdAt'],
    });
    const byId = new Map(rows.map((r) => [r.id, r]));
    const dates = new Map<string, SampleDates>(
      version.samples.map((s) => {
        const row = byId.get(s.id);
        const uploaded = day(row?.createdAt);
        return [
          s.id,
          {
            id: s.id,
            title: s.title,
            firstDate: row ? (day(row.periodStart) ?? uploaded) : null,
            lastDate: row ? (day(row.periodEnd) ?? day(row.periodStart) ?? uploaded) : null,
          },
        ];
      }),
    );
    // Oldest first by period start (upload date without one; a deleted sample last), then as frozen.
    const ordered = version.samples
      .map((s, i) => ({ s, i, at: dates.get(s.id)?.firstDate ?? null }))
      .sort((a, b) =>
        a.at === b.at ? a.i - b.i : a.at === null ? 1 : b.at === null ? -1 : a.at < b.at ? -1 : 1,
      );
    const documents = ordered.map(({ s }) => ({ id: s.id, text: s.text }));
    const base = await this.base.load();
    const entries = vocabularyOf(documents, { caseFold: settings.caseFold, inBase: (key) => base.has(key) });
    return {
      clientId: version.clientId,
      number: version.number,
      caseFold: settings.caseFold,
      vocabulary: settings.vocabulary,
      documents,
      titles: new Map(version.samples.map((s) => [s.id, s.title])),
      entries,
      words: listingWords(entries, dates, settings.vocabulary, (key) => base.has(key)),
    };
  }
}
