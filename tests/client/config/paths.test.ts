import { describe, expect, it } from 'vitest';
import { safeNextPath, signInPath } from '@/config/paths';

describe('safeNextPath', () => {
  it.each([
    ['/cars/12?tab=runs', '/cars/12?tab=runs'],
    ['https://elsewhere.example/', null],
    ['//elsewhere.example/', null],
    ['/\\elsewhere.example', null],
    ['/\t/elsewhere.example', null],
    ['/sign-in?next=/', null],
    ['/register', null],
    ['', null],
    [null, null],
  ])('when the address is %j, then it gives %j', (raw, expected) => {
    expect(safeNextPath(raw)).toBe(expected);
  });

  it('when the page to return to is Home, then the sign-in address carries no next', () => {
    expect(signInPath('/')).toBe('/sign-in');
    expect(signInPath('/cars/1')).toBe('/sign-in?next=%2Fcars%2F1');
  });
});
