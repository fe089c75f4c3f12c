/**
 * A form's Save held in reach on a phone: it sticks just above the bottom navigation (its height, 3.5rem, and its
 * 1px top border), and sits in the flow again on a wider screen, where that navigation is not shown.
 */
export const SAVE_BAR_CLASSES =
  'sticky bottom-[calc(3.5rem+1px+env(safe-area-inset-bottom))] z-10 -mx-4 flex flex-col gap-2 border-t border-line bg-canvas px-4 py-3 md:bottom-0';
