import { demoClinicStep } from './seeds/demo-clinic.seed';
import { demoClientStep } from './seeds/demo-client.seed';
import { demoSamplesStep } from './seeds/demo-samples.seed';
import { demoStaffStep } from './seeds/demo-staff.seed';
import { demoVersionStep } from './seeds/demo-version.seed';
import type { SeedStep } from './seeds/seed-step';

// Run in this order; later issues append their steps (demo clients, samples, …).
export const seedSteps: SeedStep[] = [
  demoStaffStep,
  demoClinicStep,
  demoClientStep,
  demoSamplesStep,
  demoVersionStep,
];
