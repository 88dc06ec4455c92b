import { BadRequestException, ForbiddenException, NotFoundException } from '@nestjs/common';
import { apiErrorSchema } from '@keyloom/shared';
import { BAD_VALUE_MESSAGE, DATABASE_DOWN_MESSAGE, toApiError } from './api-exception.filter';

describe('toApiError', () => {
  it('keeps the status and message of Nest exceptions, and zod issues', () => {
    expect(toApiError(new ForbiddenException('Your role does not allow this.'))).toEqual({
      statusCode: 403,
      message: 'Your role does not allow this.',
      error: 'Forbidden',
    });
    const issues = [{ path: 'email', message: 'Enter a valid e-mail address.' }];
    expect(toApiError(new BadRequestException({ message: 'Check the highlighted fields.', issues }))).toEqual(
      {
        statusCode: 400,
        message: 'Check the highlighted fields.',
        error: 'Bad Request',
        issues,
      },
    );
    expect(toApiError(new NotFoundException()).statusCode).toBe(404);
  });

  it('maps an unreachable database to 503, also when TypeORM wraps the driver error', () => {
    const refused = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' });
    expect(toApiError(refused)).toMatchObject({ statusCode: 503, message: DATABASE_DOWN_MESSAGE });
    const wrapped = Object.assign(new Error('terminating connection'), { driverError: { code: '57P01' } });
    expect(toApiError(wrapped).statusCode).toBe(503);
  });

  it('maps PostgreSQL data exceptions (class 22) to 400, also when TypeORM wraps them; other query errors stay 500', () => {
    const nul = Object.assign(new Error('invalid byte sequence for encoding "UTF8": 0x00'), {
      code: '22021',
    });
    expect(toApiError(nul)).toMatchObject({ statusCode: 400, message: BAD_VALUE_MESSAGE });
    const year0 = Object.assign(new Error('query failed'), {
      driverError: { code: '22008', message: 'date/time field value out of range: "0000-06-01"' },
    });
    expect(toApiError(year0).statusCode).toBe(400);
    // 42P01 undefined_table is the server's fault, not the input's.
    expect(toApiError(Object.assign(new Error('relation missing'), { code: '42P01' })).statusCode).toBe(500);
  });

  it('maps body-parser errors and hides everything else behind a 500', () => {
    expect(toApiError({ type: 'entity.too.large', status: 413 }).statusCode).toBe(413);
    const internal = toApiError(new Error('secret stack detail'));
    expect(internal.statusCode).toBe(500);
    expect(internal.message).not.toContain('secret');
  });

  it('always produces a body that matches the shared apiErrorSchema', () => {
    for (const thrown of [
      new Error('x'),
      'a string',
      null,
      new ForbiddenException(),
      { status: 418, expose: true },
    ]) {
      expect(apiErrorSchema.safeParse(toApiError(thrown)).success).toBe(true);
    }
  });
});
