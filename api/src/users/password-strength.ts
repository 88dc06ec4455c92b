import { BadRequestException, Injectable } from '@nestjs/common';
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as zxcvbnCommon from '@zxcvbn-ts/language-common';
import * as zxcvbnEn from '@zxcvbn-ts/language-en';

export const WEAK_PASSWORD_MESSAGE =
  'That password is too easy to guess (a common password, a repeat or a simple pattern). ' +
  'Try three or four unrelated words.';

// zxcvbn scores 0–4 (Wheeler 2016; zxcvbn-ts documentation, "score"): 3 is "safely unguessable",
// 10^8 guesses or more. Requiring 3 is common practice, no source. Checking new passwords against
// commonly used ones is what NIST SP 800-63B §5.1.1.2 asks of a verifier.
const MIN_SCORE = 3;
// Words every Keyloom password is likely to be built from (checked like dictionary words).
const PRODUCT_WORDS = ['keyloom', 'willowmere', 'clinic'];

/** Refuses common and easily guessed passwords, wherever a password is set. */
@Injectable()
export class PasswordStrength {
  private estimator?: ZxcvbnFactory;

  /** Throws a 400 on `field` when `password` scores below 3; `personal` are the account's e-mail and name. */
  assertStrong(password: string, personal: string[], field = 'password'): void {
    if (this.score(password, personal) >= MIN_SCORE) return;
    throw new BadRequestException({
      message: WEAK_PASSWORD_MESSAGE,
      issues: [{ path: field, message: WEAK_PASSWORD_MESSAGE }],
    });
  }

  score(password: string, personal: string[]): number {
    this.estimator ??= new ZxcvbnFactory({
      dictionary: { ...zxcvbnCommon.dictionary, ...zxcvbnEn.dictionary },
      graphs: zxcvbnCommon.adjacencyGraphs,
      translations: zxcvbnEn.translations,
    });
    const inputs = [
      ...PRODUCT_WORDS,
      ...personal.flatMap((text) => text.toLowerCase().split(/[^\p{L}\p{N}]+/u)),
    ];
    return this.estimator.check(
      password,
      inputs.filter((word) => word.length >= 3),
    ).score;
  }
}
