import { describe, expect, it } from 'vitest';
import { buttonClasses } from '@/components/ui/button';

const classes = (s: string) => s.split(' ');

describe('button classes', () => {
  it('when no padding or gap is asked for, then the button has the usual ones', () => {
    expect(classes(buttonClasses('secondary'))).toEqual(expect.arrayContaining(['px-5', 'gap-2']));
  });

  it('when a padding or a gap is asked for, then it replaces the usual one instead of sitting beside it', () => {
    // Of two classes setting one property the later rule in the stylesheet wins (CSS Cascading and Inheritance
    // Level 4, 6.1 "Cascade sorting", order of appearance), and Tailwind writes px-5 after px-3: both would keep 5.
    const narrow = classes(buttonClasses('secondary', 'shrink-0 px-3 gap-1'));
    expect(narrow).toEqual(expect.arrayContaining(['px-3', 'gap-1', 'shrink-0']));
    expect(narrow).not.toContain('px-5');
    expect(narrow).not.toContain('gap-2');
    // A class that only starts alike (py-…) is not a padding across.
    expect(classes(buttonClasses('quiet', 'py-1'))).toContain('px-5');
  });
});
