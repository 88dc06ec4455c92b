// Every browser suite, in the order they run. Later issues add their suite here.
import { foundationSuite } from './foundation.mjs';

export const browserSuites = [foundationSuite];
