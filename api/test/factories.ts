import type { Role, SessionUser } from '@keyloom/shared';
import bcrypt from 'bcryptjs';
import { randomUUID } from 'node:crypto';
import type { Server } from 'node:http';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { User } from '../src/users/user.entity';

export const FACTORY_PASSWORD = 'factory passphrase';
export type Agent = ReturnType<typeof request.agent>;

/** Inserts a staff account straight into the database (bcrypt cost 4), with unique defaults. */
export async function newUser(
  dataSource: DataSource,
  {
    email = `staff-${randomUUID().slice(0, 8)}@willowmere.example`,
    name = 'Test Staff',
    role = 'clinician',
    active = true,
    password = FACTORY_PASSWORD,
  }: { email?: string; name?: string; role?: Role; active?: boolean; password?: string } = {},
): Promise<SessionUser & { password: string }> {
  const repo = dataSource.getRepository(User);
  const inserted = await repo.insert({
    email,
    name,
    role,
    active,
    passwordHash: await bcrypt.hash(password, 4),
  });
  return { id: String(inserted.identifiers[0]?.id), email, name, role, password };
}

/** GET /api/auth/csrf with the agent's session; returns the token. */
export async function csrfToken(agent: Agent): Promise<string> {
  const res = await agent.get('/api/auth/csrf').expect(200);
  return (res.body as { token: string }).token;
}

/** A cookie-keeping agent signed in as `user`, with a fresh CSRF token for its new session. */
export async function signIn(
  http: Server,
  user: { email: string; password: string },
): Promise<{ agent: Agent; csrf: string }> {
  const agent = request.agent(http);
  const before = await csrfToken(agent);
  await agent
    .post('/api/auth/login')
    .set('X-CSRF-Token', before)
    .send({ email: user.email, password: user.password })
    .expect(200);
  return { agent, csrf: await csrfToken(agent) };
}

/** The session cookie's Set-Cookie line from a response, or undefined. */
export function sessionCookie(res: request.Response): string | undefined {
  const raw = res.headers['set-cookie'] as unknown;
  const lines = Array.isArray(raw) ? (raw as string[]) : typeof raw === 'string' ? [raw] : [];
  return lines.find((line) => line.startsWith('keyloom.sid='));
}

/** supertest parser that keeps a binary response body as a Buffer (`.buffer(true).parse(binaryBody)`). */
export function binaryBody(res: request.Response, done: (error: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}
