import { BadRequestException } from '@nestjs/common';
import { createUserSchema, updateUserSchema } from '@keyloom/shared';
import { INVALID_BODY_MESSAGE, ZodValidationPipe } from './zod-validation.pipe';

function rejection(run: () => unknown): { message: string; issues: { path: string; message: string }[] } {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(BadRequestException);
    return (error as BadRequestException).getResponse() as { message: string; issues: [] };
  }
  throw new Error('expected the pipe to throw');
}

describe(ZodValidationPipe.name, () => {
  const pipe = new ZodValidationPipe(createUserSchema);
  const valid = {
    email: 'Nova@Example.org',
    name: 'Nova Quill',
    role: 'carer',
    password: 'correct horse battery',
  };

  it('returns the parsed value: e-mail lower-cased, unknown keys dropped', () => {
    expect(pipe.transform({ ...valid, passwordHash: 'sneaky', id: 'x' })).toEqual({
      email: 'nova@example.org',
      name: 'Nova Quill',
      role: 'carer',
      password: 'correct horse battery',
    });
  });

  it('answers 400 with one issue per bad field, keyed by path', () => {
    const body = rejection(() =>
      pipe.transform({ email: 'not-an-address', role: 'boss', password: 'short' }),
    );
    expect(body.message).toBe(INVALID_BODY_MESSAGE);
    expect(body.issues.map((issue) => issue.path).sort()).toEqual(['email', 'name', 'password', 'role']);
    expect(body.issues.find((issue) => issue.path === 'password')?.message).toBe(
      'Use at least 12 characters.',
    );
  });

  it('explains a missing body instead of a zod type error', () => {
    const body = rejection(() => pipe.transform(undefined));
    expect(body.issues).toEqual([{ path: '', message: 'Send a JSON object as the request body.' }]);
  });

  it('reports whole-body refinements with an empty path', () => {
    const body = rejection(() => new ZodValidationPipe(updateUserSchema).transform({}));
    expect(body.issues).toEqual([{ path: '', message: 'Nothing to change.' }]);
  });
});
