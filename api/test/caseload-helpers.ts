import type { Client, Consent, Role } from '@keyloom/shared';
import type { Server } from 'node:http';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { type Agent, newUser, signIn } from './factories';

/** One signed-in person of the role × route tables; `agent` null = no session. */
export type Caller = { label: string; role: Role | null; id: string; agent: Agent | null; csrf: string };

/** The seven callers of every client route, around one client owned by `owner`. */
export type Cast = {
  owner: Caller;
  otherClinician: Caller;
  supervisor: Caller;
  assignedCarer: Caller;
  unassignedCarer: Caller;
  admin: Caller;
  anonymous: Caller;
};

async function caller(http: Server, dataSource: DataSource, label: string, role: Role): Promise<Caller> {
  const user = await newUser(dataSource, { role, name: label });
  const { agent, csrf } = await signIn(http, user);
  return { label, role, id: user.id, agent, csrf };
}

/** Creates the staff of a role × route table and signs each in. */
export async function newCast(http: Server, dataSource: DataSource): Promise<Cast> {
  return {
    owner: await caller(http, dataSource, 'clinician owner', 'clinician'),
    otherClinician: await caller(http, dataSource, 'other clinician', 'clinician'),
    supervisor: await caller(http, dataSource, 'supervisor', 'supervisor'),
    assignedCarer: await caller(http, dataSource, 'assigned carer', 'carer'),
    unassignedCarer: await caller(http, dataSource, 'unassigned carer', 'carer'),
    admin: await caller(http, dataSource, 'admin', 'admin'),
    anonymous: { label: 'no session', role: null, id: '', agent: null, csrf: '' },
  };
}

export const castOrder = [
  'owner',
  'otherClinician',
  'supervisor',
  'assignedCarer',
  'unassignedCarer',
  'admin',
  'anonymous',
] as const;

/** The status of one request per caller of `cast`, in castOrder (sent one after another). */
export async function statusesOf(
  cast: Cast,
  make: (who: Caller) => PromiseLike<{ status: number }>,
): Promise<number[]> {
  const out: number[] = [];
  for (const who of castOrder.map((key) => cast[key])) out.push((await make(who)).status);
  return out;
}

/** Sends one request as `who` (with the CSRF token on writes). */
export function send(
  http: Server,
  who: Caller,
  method: 'get' | 'post' | 'patch' | 'put' | 'delete',
  path: string,
  body?: object,
): request.Test {
  const base = who.agent ?? request(http);
  const req = base[method](path);
  if (method !== 'get' && who.csrf) req.set('X-CSRF-Token', who.csrf);
  return body === undefined ? req : req.send(body);
}

/** A client of `owner` with `carer` assigned (through the API, as a clinician would). */
export async function newClient(
  http: Server,
  owner: Caller,
  carer?: Caller,
  pseudonym = 'T. Fairweather',
): Promise<Client> {
  const res = await send(http, owner, 'post', '/api/clients', {
    pseudonym,
    accessMethod: 'switch',
    scanIntervalMs: 1200,
    goals: 'Order at the café on his own.',
    notes: 'Tires after twenty minutes.',
  }).expect(201);
  const client = res.body as Client;
  if (carer) {
    await send(http, owner, 'post', `/api/clients/${client.id}/assignments`, { userId: carer.id }).expect(
      201,
    );
  }
  return client;
}

/** A training + summaries consent given by the client himself (owning clinician). */
export async function newConsent(
  http: Server,
  owner: Caller,
  clientId: string,
  givenOn = '2026-09-14',
): Promise<Consent> {
  const res = await send(http, owner, 'post', `/api/clients/${clientId}/consents`, {
    givenBy: 'client',
    scopes: ['training', 'summaries'],
    givenOn,
  }).expect(201);
  return res.body as Consent;
}
