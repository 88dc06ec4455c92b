import { AuditEvent } from '../../audit/audit-event.entity';
import { AuditService } from '../../audit/audit.service';
import { ClientAssignment } from '../../clients/client-assignment.entity';
import { Client } from '../../clients/client.entity';
import { Consent } from '../../consents/consent.entity';
import { FamilyContact } from '../../contacts/family-contact.entity';
import { User } from '../../users/user.entity';
import type { SeedStep } from './seed-step';

// The demo client of the Willowmere demo scenario (invented): found again by pseudonym and clinician.
export const DEMO_CLIENT_PSEUDONYM = 'R. Ashby';
const CLINICIAN_EMAIL = 'clinician@willowmere.example';
const CARER_EMAIL = 'carer@willowmere.example';

const DEMO_CONTACTS = [
  {
    name: 'Hannah Ashby',
    relationship: 'sister',
    email: 'hannah.ashby@family.example',
    consentToSummaries: true,
  },
  {
    name: 'Marguerite Ashby',
    relationship: 'mother',
    email: 'marguerite.ashby@family.example',
    consentToSummaries: false,
  },
];

/**
 * The demo clinician as the acting user of later seed steps (samples, version), with an audit
 * service writing through the step's transaction.
 */
export async function demoClinicianActor(manager: Parameters<SeedStep['run']>[0]['manager']): Promise<{
  clinician: User;
  actor: { id: string; email: string; ip: null };
  audit: AuditService;
}> {
  const clinician = await manager
    .getRepository(User)
    .createQueryBuilder('user')
    .where('lower(user.email) = lower(:email)', { email: CLINICIAN_EMAIL })
    .getOneOrFail();
  return {
    clinician,
    actor: { id: clinician.id, email: clinician.email, ip: null },
    audit: new AuditService(manager.getRepository(AuditEvent)),
  };
}

/** Finds the demo client (after the staff step has run), or null. Used by the samples seed too. */
export async function findDemoClient(
  manager: Parameters<SeedStep['run']>[0]['manager'],
): Promise<Client | null> {
  return manager
    .getRepository(Client)
    .createQueryBuilder('client')
    .innerJoin(User, 'clinician', 'clinician.id = client.clinicianId')
    .where('client.pseudonym = :pseudonym', { pseudonym: DEMO_CLIENT_PSEUDONYM })
    .andWhere('lower(clinician.email) = lower(:email)', { email: CLINICIAN_EMAIL })
    .getOne();
}

export const demoClientStep: SeedStep = {
  name: 'demo client',
  async run({ manager, log }) {
    const users = manager.getRepository(User);
    const byEmail = (email: string) =>
      users.createQueryBuilder('user').where('lower(user.email) = lower(:email)', { email }).getOneOrFail();
    const clinician = await byEmail(CLINICIAN_EMAIL);
    const carer = await byEmail(CARER_EMAIL);
    const audit = manager.getRepository(AuditEvent);
    const record = (
      action: string,
      subjectType: string,
      subjectId: string,
      clientId: string,
      details: object,
    ) =>
      audit.insert({
        action,
        subjectType,
        subjectId,
        clientId,
        actorId: clinician.id,
        actorEmail: clinician.email,
        details: { ...details, by: 'seed' },
      });

    let client = await findDemoClient(manager);
    if (!client) {
      const inserted = await manager.getRepository(Client).insert({
        pseudonym: DEMO_CLIENT_PSEUDONYM,
        preferredName: 'Robbie',
        accessMethod: 'head_pointer',
        keyTimeMs: 1800,
        scanIntervalMs: null,
        dwellMs: null,
        goals:
          'Write messages to his sailing club and his sister without help; faster replies in chat. ' +
          'Keep a practice diary for jazz piano.',
        notes:
          'Head pointer since the spinal injury; tires after about 30 minutes of typing. ' +
          'Own words to watch for: Pepper (his dog), the club’s boat names, chord names.',
        clinicianId: clinician.id,
      });
      const id = String(inserted.identifiers[0]?.id);
      client = await manager.getRepository(Client).findOneByOrFail({ id });
      await record('client.create', 'client', id, id, {
        pseudonym: DEMO_CLIENT_PSEUDONYM,
        accessMethod: 'head_pointer',
      });
      log(`created ${DEMO_CLIENT_PSEUDONYM}`);
    } else {
      log(`kept ${DEMO_CLIENT_PSEUDONYM}`);
    }
    const clientId = client.id;

    const assignments = manager.getRepository(ClientAssignment);
    if (!(await assignments.existsBy({ clientId, userId: carer.id }))) {
      await assignments.insert({ clientId, userId: carer.id, assignedById: clinician.id });
      await record('assignment.create', 'client_assignment', carer.id, clientId, { carerId: carer.id });
      log(`assigned ${CARER_EMAIL}`);
    }

    const consents = manager.getRepository(Consent);
    if (!(await consents.existsBy({ clientId }))) {
      const inserted = await consents.insert({
        clientId,
        givenBy: 'client',
        representativeName: null,
        representativeRelationship: null,
        scopes: ['training', 'summaries'],
        givenOn: '2026-09-14',
        expiresOn: null,
        notes: 'Given by the client himself at the first session; signed with a stylus.',
        recordedById: clinician.id,
      });
      const id = String(inserted.identifiers[0]?.id);
      await record('consent.create', 'consent', id, clientId, {
        givenBy: 'client',
        scopes: ['training', 'summaries'],
        givenOn: '2026-09-14',
        expiresOn: null,
      });
      log('recorded the consent (training, summaries)');
    }

    const contacts = manager.getRepository(FamilyContact);
    for (const contact of DEMO_CONTACTS) {
      if (await contacts.existsBy({ clientId, email: contact.email })) continue;
      const inserted = await contacts.insert({ ...contact, clientId });
      await record('contact.create', 'family_contact', String(inserted.identifiers[0]?.id), clientId, {
        relationship: contact.relationship,
        consentToSummaries: contact.consentToSummaries,
      });
      log(`added contact ${contact.name}`);
    }
  },
};
