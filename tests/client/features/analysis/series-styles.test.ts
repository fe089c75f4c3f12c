// @vitest-environment jsdom
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import axe from 'axe-core';
import { describe, expect, it } from 'vitest';
import { isHollow, seriesStyle, type ColourScheme, type MarkerShape } from '@/features/analysis/utils/series-styles';

// Contrast as WCAG 2.2 defines it (relative luminance, (L1 + 0.05) / (L2 + 0.05)), worked out by axe-core's
// colour module, an independent library from npm.
const { Color, getContrast } = (axe as unknown as { commons: { color: { Color: new (r: number, g: number, b: number, a: number) => object; getContrast: (a: object, b: object) => number } } }).commons.color;
const rgb = (hex: string) => new Color(parseInt(hex.slice(1, 3), 16), parseInt(hex.slice(3, 5), 16), parseInt(hex.slice(5, 7), 16), 1);
const contrast = (a: string, b: string) => getContrast(rgb(a), rgb(b));
const againstWhite = (hex: string) => contrast('#FFFFFF', hex);

// The charts sit on a section card (the theme's surface colour); black is drawn in the theme's ink. Both are read
// from the stylesheet, light first and then the block the system's dark setting switches to.
const css = readFileSync(join(process.cwd(), 'src/styles/index.css'), 'utf8');
const [lightCss, darkCss] = css.split('@media (prefers-color-scheme: dark)') as [string, string];
const token = (block: string, name: string) => block.match(new RegExp(`--sl-${name}:\\s*(#[0-9a-f]{6});`, 'i'))![1]!;
const THEMES: Record<ColourScheme, { background: string; ink: string }> = {
  light: { background: token(lightCss, 'surface'), ink: token(lightCss, 'ink') },
  dark: { background: token(darkCss, 'surface'), ink: token(darkCss, 'ink') },
};

/** The first eight series as a theme draws them, each with its contrast against the chart's background. */
const drawn = (scheme: ColourScheme) =>
  Array.from({ length: 8 }, (_, i) => seriesStyle(i, scheme)).map((s) => ({
    name: s.colorName,
    shape: s.shape,
    color: s.color,
    ratio: contrast(THEMES[scheme].background, s.color ?? THEMES[scheme].ink),
  }));

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

describe('each colour against the chart\'s background, light and dark', () => {
  it('when the stylesheet is read, then the charts\' backgrounds are white and the dark theme\'s surface', () => {
    expect(THEMES).toEqual({ light: { background: '#ffffff', ink: '#131a24' }, dark: { background: '#161d27', ink: '#e8edf3' } });
  });

  it('when the dark theme is on, then every colour is at least 3:1 against the chart\'s background (WCAG 2.1 and 2.2, 1.4.11 Non-text Contrast)', () => {
    for (const s of drawn('dark')) expect(s.ratio, `${s.name} on the dark theme`).toBeGreaterThanOrEqual(3);
  });

  it('when the light theme is on, then every colour is at least 3:1 against white, or its filled mark is edged in the ink, which is', () => {
    const below = drawn('light').filter((s) => s.ratio < 3);
    // Okabe–Ito's three palest colours: orange about 2.2:1, sky blue 2.3:1, yellow 1.3:1. Their hue is kept on the light
    // theme; the marks they draw are filled, and edged in the theme's ink, which carries the contrast.
    expect(below.map((s) => s.name)).toEqual(['orange', 'sky blue', 'yellow']);
    for (const s of below) expect(isHollow(s.shape) || STROKED.includes(s.shape), `${s.name} ${s.shape}`).toBe(false);
    const outlined = (scheme: ColourScheme) => Array.from({ length: 8 }, (_, i) => seriesStyle(i, scheme)).filter((s) => s.outlined).map((s) => s.colorName);
    expect(outlined('light')).toEqual(below.map((s) => s.name));
    expect(contrast(THEMES.light.background, THEMES.light.ink)).toBeGreaterThanOrEqual(3);
    // On the dark theme every colour stands out by itself: no edge.
    expect(outlined('dark')).toEqual([]);
  });

  it('when the dark theme is on, then blue is drawn lighter and every other colour as on the light theme, which keeps Okabe–Ito\'s own', () => {
    expect(drawn('light').map((s) => s.color)).toEqual(['#E69F00', '#56B4E9', '#009E73', '#D55E00', '#0072B2', '#CC79A7', '#F0E442', null]);
    expect(drawn('dark').map((s) => s.color)).toEqual(['#E69F00', '#56B4E9', '#009E73', '#D55E00', '#4C8CF5', '#CC79A7', '#F0E442', null]);
    const blue = (scheme: ColourScheme) => drawn(scheme).find((s) => s.name === 'blue')!;
    // The open square, a thin outline: 3.3:1 in Okabe–Ito's blue on the dark surface, 5.2:1 in the lighter one.
    expect(blue('dark').shape).toBe('rectRounded');
    expect(contrast(THEMES.dark.background, '#0072B2')).toBeCloseTo(3.27, 2);
    expect(blue('dark').ratio).toBeCloseTo(5.15, 2);
  });
});
