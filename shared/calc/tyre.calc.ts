/**
 * Tyre size → nominal dimensions. A metric size "W/AR R D" gives the section width W (mm), the aspect ratio AR
 * (sidewall height as a % of the width: Yokohama "Basic Tyre Knowledge") and the rim diameter D (inches).
 *
 *   sidewall H = W·AR/100;  overall diameter OD = 25.4·D + 2H;  circumference C = π·OD;
 *   rev/km = 1 000 000 / C(mm);  rev/mile = 1 609 344 / C(mm)  (international mile, exact).
 *
 * These are NOMINAL design values (ETRTO / Tire and Rim Association conventions). A real tyre differs with its
 * measuring rim, brand, inflation and wear (about 12.7 mm less OD from 10/32 to 2/32 in of tread), and its loaded
 * rolling circumference is smaller than π·OD. Label them "nominal" wherever they are shown.
 */
import { MM_PER_INCH } from './units.calc';

export interface TyreDimensions {
  sectionWidthMm: number;
  /** Sidewall height as a percentage of the section width. */
  aspectRatio: number;
  rimDiameterIn: number;
  sidewallMm: number;
  overallDiameterMm: number;
  circumferenceMm: number;
  revsPerKm: number;
  revsPerMile: number;
}

const MM_PER_KM = 1_000_000;
/** 1 international mile = 1760 yd × 0.9144 m = 1 609 344 mm exactly. */
const MM_PER_MILE = 1_609_344;

/**
 * Width (2–3 digits) / aspect ratio (2 digits), the construction letter R (or ZR, the old speed marking), rim
 * diameter (2 digits, or e.g. 16.5). Spaces are allowed around "/" and "R"; letters in either case; an optional
 * leading "P" (P-metric passenger size, same dimensions).
 */
const SIZE_PATTERN = /^P?\s*(\d{2,3})\s*\/\s*(\d{2})\s*Z?R\s*(\d{2}(?:\.5)?)$/i;

const malformed = (size: unknown) =>
  new Error(`"${String(size)}" is not a tyre size we can read. Use a size like 245/40R18 (width mm / aspect ratio % R rim inches).`);

/**
 * The nominal dimensions of a metric tyre size such as "245/40R18", "245/40 R 18", "245/40ZR18" or " 245/40r18 ".
 * @throws Error ("Use a size like 245/40R18") when the size cannot be read.
 */
export function tyreDimensions(size: string): TyreDimensions {
  if (typeof size !== 'string') throw malformed(size);
  const match = SIZE_PATTERN.exec(size.trim());
  if (!match) throw malformed(size);
  const sectionWidthMm = Number(match[1]);
  const aspectRatio = Number(match[2]);
  const rimDiameterIn = Number(match[3]);
  if (!(sectionWidthMm > 0) || !(aspectRatio > 0) || !(rimDiameterIn > 0)) throw malformed(size);

  const sidewallMm = (sectionWidthMm * aspectRatio) / 100;
  const overallDiameterMm = rimDiameterIn * MM_PER_INCH + 2 * sidewallMm;
  const circumferenceMm = Math.PI * overallDiameterMm;
  return {
    sectionWidthMm,
    aspectRatio,
    rimDiameterIn,
    sidewallMm,
    overallDiameterMm,
    circumferenceMm,
    revsPerKm: MM_PER_KM / circumferenceMm,
    revsPerMile: MM_PER_MILE / circumferenceMm,
  };
}
