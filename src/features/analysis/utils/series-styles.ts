/**
 * How a series (an event, a driver) is drawn: a colour from Okabe & Ito's colour-blind-safe palette (2008) AND a
 * marker shape, so that no series depends on colour alone. Shapes are Chart.js point styles; `glyph` is the same
 * shape in text, for legends and tables outside the canvas.
 */
export type MarkerShape = 'circle' | 'triangle' | 'rect' | 'rectRot' | 'star' | 'crossRot' | 'rectRounded' | 'cross';

/** The page's colour scheme: the light theme, or the dark one the system asks for (src/styles/index.css). */
export type ColourScheme = 'light' | 'dark';

/**
 * Okabe–Ito, most distinct first; black last (it is swapped for the theme's ink, so it shows on the dark theme too).
 * `onDark` is drawn instead on the dark theme, where Okabe–Ito's own colour is too dark to see well: their blue is
 * only 3.3:1 against the dark surface, and it draws the open square, a thin outline. The lighter blue is 5.2:1 there.
 * `paleOnLight`: under 3:1 against the light theme's white (WCAG 2.1 SC 1.4.11), so on the light theme its
 * filled marker gets an outline in the theme's ink, keeping its hue.
 */
export const OKABE_ITO: readonly { name: string; hex: string; onDark?: string; paleOnLight?: boolean }[] = [
  { name: 'orange', hex: '#E69F00', paleOnLight: true },
  { name: 'sky blue', hex: '#56B4E9', paleOnLight: true },
  { name: 'bluish green', hex: '#009E73' },
  { name: 'vermillion', hex: '#D55E00' },
  { name: 'blue', hex: '#0072B2', onDark: '#4C8CF5' },
  { name: 'reddish purple', hex: '#CC79A7' },
  { name: 'yellow', hex: '#F0E442', paleOnLight: true },
  { name: 'black', hex: '#000000' },
];

/**
 * In the order the colours above take them, so the first eight series pair them one to one: the marks drawn
 * with the least ink (the open square, the star) go to the darkest colours, and the palest colour (yellow, about
 * 1.3:1 against white) gets the filled square, the mark with the most.
 */
const SHAPES: readonly { shape: MarkerShape; glyph: string; name: string }[] = [
  { shape: 'circle', glyph: '●', name: 'circle' },
  { shape: 'triangle', glyph: '▲', name: 'triangle' },
  { shape: 'star', glyph: '✱', name: 'star' },
  { shape: 'rectRot', glyph: '◆', name: 'diamond' },
  { shape: 'rectRounded', glyph: '▢', name: 'open square' },
  { shape: 'crossRot', glyph: '✕', name: 'cross' },
  { shape: 'rect', glyph: '■', name: 'square' },
  { shape: 'cross', glyph: '✚', name: 'plus' },
];

/**
 * Shapes the chart draws as an outline only, as their glyph shows them: the rounded square (▢), which filled
 * would be hard to tell from the square (■) at a marker's size.
 */
export const isHollow = (shape: MarkerShape | 'line') => shape === 'rectRounded';

export interface SeriesStyle {
  /** A hex colour for the colour scheme asked for; `null` means "the theme's ink colour" (Okabe–Ito black). */
  color: string | null;
  colorName: string;
  shape: MarkerShape;
  glyph: string;
  shapeName: string;
  /** Draw the marker's edge in the theme's ink: a pale colour on the light theme. */
  outlined: boolean;
}

/**
 * The style of the i-th series: colour and shape both change, and the pair stays unique for 64 series. On the dark
 * scheme a colour may be drawn lighter (`onDark`); its name, shape and place stay the same.
 */
export function seriesStyle(index: number, scheme: ColourScheme = 'light'): SeriesStyle {
  const i = Math.max(0, Math.floor(index));
  const colour = OKABE_ITO[i % OKABE_ITO.length]!;
  const shape = SHAPES[(i + Math.floor(i / OKABE_ITO.length)) % SHAPES.length]!;
  return {
    color: colour.name === 'black' ? null : scheme === 'dark' ? (colour.onDark ?? colour.hex) : colour.hex,
    colorName: colour.name,
    shape: shape.shape,
    glyph: shape.glyph,
    shapeName: shape.name,
    outlined: scheme === 'light' && colour.paleOnLight === true,
  };
}
