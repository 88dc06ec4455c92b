import { z } from 'zod';
import { safeText } from './common';

// An e-mail address as typed: surrounding spaces removed and lower-cased
// before the format is checked, so " Ann@Clinic.example " is accepted.
export const emailField = safeText({ error: 'Enter a valid e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(
    z
      .email({ error: 'Enter a valid e-mail address.' })
      .max(254, { error: 'That e-mail address is too long.' }),
  );
