import { todayIso } from '@/lib/format';

/** The 30 days up to today (in the reader's time zone), as the period a new summary starts with. */
export const defaultPeriod = (now = new Date()): { from: string; to: string } => {
  const start = new Date(now);
  start.setDate(start.getDate() - 30);
  return { from: todayIso(start), to: todayIso(now) };
};
