import { z } from 'zod';
import {
  checkClientVocabulary,
  MAX_ADDITION_WEIGHT,
  VocabularyError,
} from '../engine/words/client-vocabulary';
import { wordKey } from '../engine/words/word-tokens';
import { numberField, safeText } from './common';

// A client's vocabulary as the clinician shapes it: words and short phrases added (learned as if
// written `weight` times) and words blocked (never offered; a block may name a replacement offered
// in its place). The one contract for forms, API bodies, the version settings they are frozen into,
// and the engine (engine/words/client-vocabulary.ts takes its types from here; the word rules —
// one word per block, at most six words per addition, a replacement not blocked itself — are the
// engine's, run by the refinement below).

/** Most additions and blocks per client (a device vocabulary, not a dictionary; common practice, no source). */
export const MAX_VOCABULARY_ADDITIONS = 2000;
export const MAX_VOCABULARY_BLOCKS = 5000;

const weightMessage = `Enter a weight from 1 to ${MAX_ADDITION_WEIGHT}, or leave it empty.`;

export const vocabularyAdditionSchema = z.object({
  text: safeText({ error: 'Enter a word or a short phrase.' })
    .trim()
    .min(1, { error: 'Enter a word or a short phrase.' })
    .max(80, { error: 'Keep an addition under 80 characters.' }),
  /** Learned as if written this many times (default DEFAULT_ADDITION_WEIGHT). */
  weight: numberField(
    z
      .number({ error: weightMessage })
      .int({ error: weightMessage })
      .min(1, { error: weightMessage })
      .max(MAX_ADDITION_WEIGHT, { error: weightMessage }),
  ).optional(),
});

export const vocabularyBlockSchema = z.object({
  word: safeText({ error: 'Enter the word to block.' })
    .trim()
    .min(1, { error: 'Enter the word to block.' })
    .max(60, { error: 'Keep a word under 60 characters.' }),
  /** Offered where the blocked word would have been (e.g. the right spelling). */
  replacement: safeText()
    .trim()
    .max(60, { error: 'Keep a word under 60 characters.' })
    .optional()
    .transform((value) => (value ? value : undefined)),
});

export const clientVocabularySchema = z
  .object({
    additions: z
      .array(vocabularyAdditionSchema)
      .max(MAX_VOCABULARY_ADDITIONS, { error: `At most ${MAX_VOCABULARY_ADDITIONS} additions.` })
      .default([]),
    blocks: z
      .array(vocabularyBlockSchema)
      .max(MAX_VOCABULARY_BLOCKS, { error: `At most ${MAX_VOCABULARY_BLOCKS} blocked words.` })
      .default([]),
  })
  .superRefine((vocabulary, ctx) => {
    const added = new Set<string>();
    vocabulary.additions.forEach((a, i) => {
      const key = wordKey(a.text);
      if (added.has(key))
        ctx.addIssue({
          code: 'custom',
          path: ['additions', i, 'text'],
          message: `"${a.text}" is already added.`,
        });
      added.add(key);
    });
    const blocked = new Set<string>();
    vocabulary.blocks.forEach((b, i) => {
      const key = wordKey(b.word);
      if (blocked.has(key))
        ctx.addIssue({
          code: 'custom',
          path: ['blocks', i, 'word'],
          message: `"${b.word}" is already blocked.`,
        });
      if (added.has(key))
        ctx.addIssue({
          code: 'custom',
          path: ['blocks', i, 'word'],
          message: `"${b.word}" is also added: remove the addition or the block.`,
        });
      blocked.add(key);
    });
    try {
      checkClientVocabulary(vocabulary);
    } catch (error) {
      if (!(error instanceof VocabularyError)) throw error;
      ctx.addIssue({ code: 'custom', path: [], message: error.message });
    }
  });
export type ClientVocabulary = z.output<typeof clientVocabularySchema>;
export type VocabularyAddition = z.output<typeof vocabularyAdditionSchema>;
export type VocabularyBlock = z.output<typeof vocabularyBlockSchema>;

// GET/PUT /api/clients/:id/vocabulary: the client's current additions and blocks (what the next
// version freezes into its settings), and the spellings the clinician accepted as the client's own
// (left out of the misspelling review). `revision` goes up by one with every saved change; a PUT
// names the revision it changed, and a stale one is refused (409), so two tabs cannot overwrite
// each other and a double submission saves once.
export const keptSpellingsSchema = z
  .array(safeText().trim().min(1).max(60))
  .max(MAX_VOCABULARY_BLOCKS)
  .default([]);

export const updateClientVocabularySchema = z.object({
  revision: z.number().int().min(0),
  vocabulary: clientVocabularySchema,
  keptSpellings: keptSpellingsSchema,
});
export type UpdateClientVocabularyInput = z.input<typeof updateClientVocabularySchema>;

export const clientVocabularyStateSchema = z.object({
  clientId: z.uuid(),
  revision: z.number().int(),
  vocabulary: clientVocabularySchema,
  keptSpellings: z.array(z.string()),
  updatedAt: z.string().nullable(),
  updatedBy: z.string().nullable(),
});
export type ClientVocabularyState = z.output<typeof clientVocabularyStateSchema>;

// GET /api/profile-versions/:id/vocabulary?query=&sort=&order=&show=&page=&pageSize=
export const vocabularySorts = ['count', 'word', 'first', 'last'] as const;
export const vocabularyShows = ['all', 'not_in_base', 'added', 'blocked'] as const;
export const vocabularyQuerySchema = z.object({
  /** Words starting with (or containing) this text, matched on the lower-case key. */
  query: safeText().trim().max(60).default(''),
  sort: z.enum(vocabularySorts, { error: 'Sort by count, word, first or last.' }).default('count'),
  /** Default: most first for count, A–Z for word, oldest first for first and last use. */
  order: z.enum(['asc', 'desc']).optional(),
  show: z.enum(vocabularyShows).default('all'),
  page: numberField(z.number().int().min(1)).default(1),
  pageSize: numberField(z.number().int().min(10).max(200)).default(50),
});
export type VocabularyQuery = z.output<typeof vocabularyQuerySchema>;

export const vocabularyWordSchema = z.object({
  key: z.string(),
  /** The commonest written form (or the clinician's, for an addition). */
  word: z.string(),
  /** Times written in the version's samples (0 for an addition the client has not written). */
  count: z.number().int(),
  samples: z.array(z.object({ id: z.string(), title: z.string(), count: z.number().int() })),
  /** The first and last sample it occurs in: their periods' start and end dates (YYYY-MM-DD), or null. */
  firstUsed: z.string().nullable(),
  lastUsed: z.string().nullable(),
  /** Whether the base vocabulary (general English) knows it. */
  inBase: z.boolean(),
  added: z.boolean(),
  blocked: z.boolean(),
  replacement: z.string().nullable(),
});
export type VocabularyWord = z.output<typeof vocabularyWordSchema>;

export const vocabularyPageSchema = z.object({
  versionId: z.uuid(),
  /** Words matching the query and filter, and words in the whole listing. */
  total: z.number().int(),
  totalWords: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  words: z.array(vocabularyWordSchema),
});
export type VocabularyPage = z.output<typeof vocabularyPageSchema>;

// GET /api/profile-versions/:id/misspellings: the version's words that look like misspellings of a
// much more frequent word, without those the client's list already blocks or keeps.
export const misspellingSchema = z.object({
  key: z.string(),
  word: z.string(),
  count: z.number().int(),
  corrections: z.array(z.object({ word: z.string(), distance: z.number().int(), perMillion: z.number() })),
});
export const misspellingListSchema = z.object({
  versionId: z.uuid(),
  candidates: z.array(misspellingSchema),
});
export type Misspelling = z.output<typeof misspellingSchema>;
export type MisspellingList = z.output<typeof misspellingListSchema>;
