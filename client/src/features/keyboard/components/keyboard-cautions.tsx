import { cautions } from '@keyloom/shared';
import { Alert } from '@/components/ui/alert';

// The cautions that concern the test keyboard, in the wording the printed reports use
// (shared/src/reports/cautions.ts): suggestions are offered, the keyboard is for trials, keystroke
// savings are not time savings.
const keyboardCautions = [cautions.offeredNotInserted, cautions.notForEmergencies, cautions.notTimeSavings];

/** The cautions of the test keyboard, near the top of its page, in Keyloom's words. */
export const KeyboardCautions = () => (
  <Alert tone="info" title="Before you start">
    <ul className="list-disc pl-5">
      {keyboardCautions.map((caution) => (
        <li key={caution}>{caution}</li>
      ))}
    </ul>
  </Alert>
);
