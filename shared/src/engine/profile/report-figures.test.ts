import { describe, expect, it } from 'vitest';
import { reportFigures } from './report-figures';

describe('reportFigures', () => {
  it('reads keystroke savings at the slot count and both rates of a stored report', () => {
    const stored = { keystrokeSavings: { '3': 0.31, '5': 0.36 }, rates: { wpmWith: 7.4, wpmWithout: 6.1 } };
    expect(reportFigures(stored, 5)).toEqual({ keystrokeSavings: 0.36, wpmWith: 7.4, wpmWithout: 6.1 });
  });

  it('gives null for each figure that is missing or not a finite number, and keeps the others', () => {
    const odd = { keystrokeSavings: { '5': '0.36' }, rates: { wpmWith: Infinity, wpmWithout: 6.1 } };
    expect(reportFigures(odd, 5)).toEqual({ keystrokeSavings: null, wpmWith: null, wpmWithout: 6.1 });
    expect(reportFigures({ keystrokeSavings: { '5': 0.36 } }, 4)).toEqual({
      keystrokeSavings: null,
      wpmWith: null,
      wpmWithout: null,
    });
    expect(reportFigures(null, 5)).toEqual({ keystrokeSavings: null, wpmWith: null, wpmWithout: null });
    expect(reportFigures([1, 2], 5)).toEqual({ keystrokeSavings: null, wpmWith: null, wpmWithout: null });
  });
});
