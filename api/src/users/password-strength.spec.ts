import { BadRequestException } from '@nestjs/common';
import { PasswordStrength, WEAK_PASSWORD_MESSAGE } from './password-strength';

describe('PasswordStrength', () => {
  const strength = new PasswordStrength();

  it.each(['aaaaaaaaaaaa', 'password1234', 'qwertyuiop12', '123456789012'])('refuses %j', (password) => {
    expect(strength.score(password, [])).toBeLessThan(3);
    expect(() => strength.assertStrong(password, [])).toThrow(BadRequestException);
  });

  it('accepts a passphrase of unrelated words', () => {
    expect(strength.score('Tulip-Harbour-Lantern-42', [])).toBeGreaterThanOrEqual(3);
    expect(() => strength.assertStrong('Tulip-Harbour-Lantern-42', [])).not.toThrow();
  });

  it("counts the account's own name and e-mail as easy guesses", () => {
    const personal = ['orla.pennick@willowmere.example', 'Orla Pennick'];
    expect(strength.score('orlapennick', [])).toBeGreaterThanOrEqual(3);
    expect(strength.score('orlapennick', personal)).toBeLessThan(3);
  });

  it('reports the problem on the named field', () => {
    try {
      strength.assertStrong('password1234', [], 'newPassword');
      throw new Error('expected a refusal');
    } catch (error) {
      expect((error as BadRequestException).getResponse()).toEqual({
        message: WEAK_PASSWORD_MESSAGE,
        issues: [{ path: 'newPassword', message: WEAK_PASSWORD_MESSAGE }],
      });
    }
  });
});
