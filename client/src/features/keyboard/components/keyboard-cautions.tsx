import { Alert } from '@/components/ui/alert';

/** The cautions of the test keyboard, near the top of its page, in Keyloom's words. */
export const KeyboardCautions = ({ pseudonym }: { pseudonym: string }) => (
  <Alert tone="info" title="Before you start">
    <ul className="list-disc pl-5">
      <li>Suggestions are offered, never inserted on their own: a word goes in only when it is picked.</li>
      <li>
        This keyboard is for trying a profile. It is not a communication aid for emergencies: keep {pseudonym}
        ’s usual way of communicating at hand.
      </li>
      <li>Keystroke savings are not time savings: reading the suggestions takes time too.</li>
    </ul>
  </Alert>
);
