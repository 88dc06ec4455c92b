// Every browser suite, in the order they run. Later issues add their suite here.
import { caseloadSuite } from './caseload.mjs';
import { dwellTargetsSuite } from './dwell-targets.mjs';
import { focusWalkSuite } from './focus-walk.mjs';
import { foundationSuite } from './foundation.mjs';
import { keyboardSuite } from './keyboard.mjs';
import { profilesSuite } from './profiles.mjs';
import { reportSuite } from './report.mjs';
import { summariesSuite } from './summaries.mjs';
import { trialViewSuite } from './trial-view.mjs';
import { vocabularyKeyboardSuite } from './vocabulary-keyboard.mjs';

export const browserSuites = [
  foundationSuite,
  caseloadSuite,
  profilesSuite,
  keyboardSuite,
  dwellTargetsSuite,
  trialViewSuite,
  summariesSuite,
  vocabularyKeyboardSuite,
  focusWalkSuite,
  reportSuite,
];
