import { installProcessGuards, isConnectionError } from './process-guards';

const withCode = (message: string, code: string) => Object.assign(new Error(message), { code });

describe('isConnectionError', () => {
  it('knows lost and refused connections (Node socket codes, pg client messages, SQLSTATE 08 and 57P01–57P03)', () => {
    expect(isConnectionError(new Error('Connection terminated unexpectedly'))).toBe(true);
    expect(isConnectionError(withCode('read ECONNRESET', 'ECONNRESET'))).toBe(true);
    expect(isConnectionError(withCode('connect ECONNREFUSED 127.0.0.1:5432', 'ECONNREFUSED'))).toBe(true);
    expect(isConnectionError(withCode('canceling authentication due to timeout', '08P01'))).toBe(true);
    expect(isConnectionError(withCode('terminating connection due to administrator command', '57P01'))).toBe(
      true,
    );
    expect(isConnectionError(withCode('the database system is starting up', '57P03'))).toBe(true);
  });

  it('leaves everything else to the exit path', () => {
    expect(isConnectionError(new TypeError("Cannot read properties of undefined (reading 'id')"))).toBe(
      false,
    );
    expect(isConnectionError(withCode('duplicate key value violates unique constraint', '23505'))).toBe(
      false,
    );
    expect(isConnectionError(withCode('canceling statement due to user request', '57014'))).toBe(false);
    expect(isConnectionError('Connection terminated')).toBe(false);
  });
});

describe('installProcessGuards', () => {
  const before = {
    rejection: process.listeners('unhandledRejection'),
    exception: process.listeners('uncaughtException'),
  };
  afterEach(() => {
    process.removeAllListeners('unhandledRejection');
    process.removeAllListeners('uncaughtException');
    for (const l of before.rejection) process.on('unhandledRejection', l);
    for (const l of before.exception) process.on('uncaughtException', l);
  });

  it('logs an unhandled rejection and a lost connection and goes on; exits 1 on any other uncaught exception', () => {
    const errors: string[] = [];
    const exits: number[] = [];
    installProcessGuards({ error: (m) => errors.push(m) }, (code) => exits.push(code));
    // What Node emits for a rejection nobody handled and an exception nobody caught.
    const emit = process.emit.bind(process) as (event: string, ...args: unknown[]) => boolean;
    emit('unhandledRejection', new Error('Connection terminated unexpectedly'), Promise.resolve());
    emit('uncaughtException', withCode('read ECONNRESET', 'ECONNRESET'), 'uncaughtException');
    expect(exits).toEqual([]);
    emit('uncaughtException', new TypeError('x is not a function'), 'uncaughtException');
    expect(exits).toEqual([1]);
    expect(errors).toHaveLength(3);
    expect(errors[0]).toMatch(
      /^Unhandled rejection \(the worker goes on\): Connection terminated unexpectedly/,
    );
    expect(errors[1]).toMatch(/^Lost a connection \(the worker goes on\): read ECONNRESET/);
    expect(errors[2]).toMatch(/^Uncaught exception, exiting .*: x is not a function/);
  });
});
