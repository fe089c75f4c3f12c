import type { ColourScheme } from '../utils/series-styles';
import { useMediaQuery } from './use-media-query';

/**
 * The colour scheme the page is drawn in: dark when the system asks for it, as src/styles/index.css decides, so a
 * chart's colours follow the page's; light where the browser cannot tell.
 */
export function useColourScheme(): ColourScheme {
  return useMediaQuery('(prefers-color-scheme: dark)') ? 'dark' : 'light';
}
