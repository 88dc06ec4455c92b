import axe from 'axe-core';
import { describe, expect, it } from 'vitest';
import {
  chartColours,
  chartSeries,
  chartSeriesLook,
  chartTextPairs,
  contrastRatio,
  hexToRgb,
  okabeItoPalette,
  relativeLuminance,
  type HexColour,
} from './chart-theme';

// axe-core's colour module (a general-purpose accessibility checker, npm axe-core 4.14.1) computes
// the same WCAG 2.x contrast; it serves as the reference for our formula.
function axeContrast(a: HexColour, b: HexColour): number {
  const toColour = (hex: HexColour) => new axe.commons.color.Color(...hexToRgb(hex), 1);
  return axe.commons.color.getContrast(toColour(a), toColour(b));
}

describe('WCAG 2.x contrast', () => {
  it('gives the values the definition fixes and the usual examples', () => {
    // Black on white is 21:1 and a colour on itself 1:1 (WCAG 2.x, definition of contrast ratio).
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 6);
    expect(contrastRatio('#0072B2', '#0072B2')).toBeCloseTo(1, 6);
    expect(relativeLuminance('#FFFFFF')).toBeCloseTo(1, 6);
    // #767676 on white is 4.54:1, the lightest grey that passes 4.5:1 (common practice; from memory).
    expect(contrastRatio('#767676', '#FFFFFF')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#FFFFFF')).toBeLessThan(4.5);
  });

  it('agrees with axe-core on every colour of the theme', () => {
    const colours = [...Object.values(okabeItoPalette), ...Object.values(chartColours)];
    for (const colour of colours) {
      expect(contrastRatio(colour, chartColours.background)).toBeCloseTo(
        axeContrast(colour, chartColours.background),
        2,
      );
    }
  });

  it('refuses a colour that is not #rrggbb', () => {
    expect(() => hexToRgb('#fff')).toThrow(RangeError);
  });
});

describe('chart theme', () => {
  it('keeps text at 4.5:1 or more on the chart background (WCAG 2.x, normal text)', () => {
    for (const pair of chartTextPairs) {
      expect(contrastRatio(pair.text, pair.background), pair.name).toBeGreaterThanOrEqual(4.5);
    }
  });

  it('keeps series marks and axes at 3:1 or more on the background (WCAG 2.x non-text contrast)', () => {
    for (const colour of [...chartSeries.map((s) => s.colour), chartColours.axis]) {
      expect(contrastRatio(colour, chartColours.background), colour).toBeGreaterThanOrEqual(3);
    }
  });

  it('draws series in Okabe–Ito colours, each with its own colour, marker and dash', () => {
    const palette: string[] = Object.values(okabeItoPalette);
    for (const look of chartSeries) expect(palette).toContain(look.colour);
    expect(new Set(chartSeries.map((s) => s.colour)).size).toBe(chartSeries.length);
    expect(new Set(chartSeries.map((s) => s.marker)).size).toBe(chartSeries.length);
    expect(new Set(chartSeries.map((s) => s.dash)).size).toBe(chartSeries.length);
    expect(() => chartSeriesLook(chartSeries.length)).toThrow(RangeError);
  });
});
