// --vocabulary FILE.json: a client's added and blocked words for the commands that train and
// measure (evaluate, suggest, bench), in the shape the API keeps them (clientVocabularySchema:
// {"additions":[{"text","weight"?}],"blocks":[{"word","replacement"?}]}). A file that cannot be
// used is a UsageError: one line naming the file and the first problem.
import { type ClientVocabulary, clientVocabularySchema, EMPTY_VOCABULARY } from '@keyloom/shared';
import { optionValue, readTextFile, type ParsedArgs } from './args';
import { UsageError } from './cli-errors';

/** Reads and checks a vocabulary file. @throws UsageError with a one-line message */
export function readVocabularyFile(path: string): ClientVocabulary {
  const text = readTextFile(path);
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new UsageError(`--vocabulary ${path} is not JSON (${oneLine((error as Error).message)})`);
  }
  const parsed = clientVocabularySchema.safeParse(json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const where = issue.path.length > 0 ? ` at ${issue.path.join('.')}` : '';
    throw new UsageError(`--vocabulary ${path}${where}: ${oneLine(issue.message)}`);
  }
  return parsed.data;
}

/** The --vocabulary option's file read and checked, or no additions and no blocks. */
export function vocabularyOption(parsed: ParsedArgs): ClientVocabulary {
  const path = optionValue(parsed, 'vocabulary');
  return path === undefined ? EMPTY_VOCABULARY : readVocabularyFile(path);
}

const oneLine = (message: string): string => message.replace(/\s+/g, ' ').trim();
