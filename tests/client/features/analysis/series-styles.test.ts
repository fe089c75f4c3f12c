// @vitest-environment jsdom
import axe from 'axe-core';
import { describe, expect, it } from 'vitest';
import { isHollow, seriesStyle, type MarkerShape } from '@/features/analysis/utils/series-styles';

// Contrast as WCAG 2.2 defines it (relative luminance, (L1 + 0.05) / (L2 + 0.05)), worked out by axe-core's
// colour module, an independent library from npm.
const { Color, getContrast } = (axe as unknown as { commons: { color: { Color: new (r: number, g: number, b: number, a: number) => object; getContrast: (a: object, b: object) => number } } }).commons.color;
const rgb = (hex: string) => new Color(parseInt(hex.slice(1, 3), 16), parseInt(hex.slice(3, 5), 16), parseInt(hex.slice(5, 7), 16), 1);
const againstWhite = (hex: string) => getContrast(rgb('#FFFFFF'), rgb(hex));

// Chart.js draws these with lines only; the rest are filled shapes (Chart.js 4 docs, "Point Styles").
const STROKED: readonly MarkerShape[] = ['star', 'crossRot', 'cross'];

describe('how each series is drawn', () => {
  it('when eight series are styled, then every mark drawn as lines or as an outline has a colour of at least 3:1 against white (WCAG 2.2, 1.4.11)', () => {
    const styles = Array.from({ length: 8 }, (_, i) => seriesStyle(i));
    const thin = styles.filter((s) => isHollow(s.shape) || STROKED.includes(s.shape));
    expect(thin.map((s) => s.shape).sort()).toEqual(['cross', 'crossRot', 'rectRounded', 'star']);
    // Black stands for the theme's ink (null), which is the page's text colour.
    for (const s of thin) expect(againstWhite(s.color ?? '#000000'), `${s.shapeName} in ${s.colorName}`).toBeGreaterThanOrEqual(3);
  });

  it('when the palest colour is used, then its mark is a filled one', () => {
    const yellow = Array.from({ length: 64 }, (_, i) => seriesStyle(i)).filter((s) => s.colorName === 'yellow');
    expect(yellow[0]!.shape).toBe('rect');
    expect(yellow.length).toBe(8);
  });

  it('when 64 series are styled, then no two share both colour and shape', () => {
    const pairs = new Set(Array.from({ length: 64 }, (_, i) => seriesStyle(i)).map((s) => `${s.colorName}/${s.shape}`));
    expect(pairs.size).toBe(64);
  });
});
