// Keyloom's own practice phrases for trials: invented for Keyloom, everyday and short, lower case
// (the test keyboard has no shift key), using only the keys it has (letters, space and . , ? ' -).
import type { PracticePhrase } from '../schemas/trials.schema';

const phrases = [
  'can you open the window a little',
  'i would like a cup of tea please',
  'what time is it now?',
  'please turn the music down',
  'i am tired and want to rest',
  'thank you for helping me today',
  'can we go outside after lunch?',
  'my left arm hurts a bit',
  'call my sister this evening',
  'i want to watch the football',
  'the soup is too hot',
  'where did you put my glasses?',
  'let us play cards later',
  'i need the bathroom, please',
  'tell me about your weekend',
  "i don't want that one",
  'can you read the letter to me?',
  'it is cold in here',
  'i liked the film last night',
  'please move my chair to the left',
  'when is the next visit?',
  'say hello to the dog for me',
  'i am happy with that',
  'could you charge my tablet?',
] as const;

/** Keyloom's built-in practice phrases, ids "kl-01" … (stable: trials refer to them). */
export const builtInPracticePhrases: readonly PracticePhrase[] = phrases.map((text, index) => ({
  id: `kl-${String(index + 1).padStart(2, '0')}`,
  text,
  source: 'keyloom',
  addedBy: null,
  createdAt: null,
}));
