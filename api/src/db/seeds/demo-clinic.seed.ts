import { AuditEvent } from '../../audit/audit-event.entity';
import { ClinicSettingsRow } from '../../clinic/clinic-settings.entity';
import type { SeedStep } from './seed-step';

// The demo clinic's details, invented. 01632 960xxx is in the UK range Ofcom keeps for drama
// (numbers that reach nobody; docs/references.md §6); the street, town and postcode are made up.
export const DEMO_CLINIC = {
  name: 'Willowmere Community Communication Clinic',
  phone: '01632 960 418',
  address: 'Unit 4, The Old Ropeworks\n27 Larkspur Lane\nWillowmere\nWM4 7QJ',
  email: 'clinic@willowmere.example',
  website: 'https://willowmere.example',
} as const;

/** Sets the clinic's details once; details an admin has saved since are kept. */
export const demoClinicStep: SeedStep = {
  name: 'demo clinic details',
  async run({ manager, log }) {
    const repo = manager.getRepository(ClinicSettingsRow);
    if (await repo.existsBy({ id: 1 })) {
      log('kept the clinic details');
      return;
    }
    await repo.insert({ id: 1, ...DEMO_CLINIC, updatedById: null });
    const changes = Object.fromEntries(
      Object.entries(DEMO_CLINIC).map(([field, to]) => [field, { from: null, to }]),
    );
    await manager.getRepository(AuditEvent).insert({
      action: 'clinic-settings.update',
      subjectType: 'clinic_settings',
      subjectId: '1',
      details: { changes, by: 'seed' },
    });
    log(`set the clinic details (${DEMO_CLINIC.name})`);
  },
};
