import { z } from 'zod';
import { pageQuerySchema } from './common';

// GET /api/audit (supervisor, admin): filters and one page of events, newest first.
export const auditQuerySchema = pageQuerySchema.extend({
  clientId: z.uuid().optional(),
  userId: z.uuid().optional(),
  // An exact action ("sample.upload") or a prefix ending in "." ("sample.").
  action: z.string().trim().max(80).optional(),
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export const auditEventSchema = z.object({
  id: z.string(),
  at: z.string(),
  actorId: z.uuid().nullable(),
  actorEmail: z.string().nullable(),
  action: z.string(),
  subjectType: z.string().nullable(),
  subjectId: z.string().nullable(),
  clientId: z.uuid().nullable(),
  clientPseudonym: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  ip: z.string().nullable(),
});
export type AuditEventView = z.infer<typeof auditEventSchema>;

export const auditPageSchema = z.object({
  items: z.array(auditEventSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type AuditPage = z.infer<typeof auditPageSchema>;
