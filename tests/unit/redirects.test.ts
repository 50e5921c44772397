import { describe, it, expect } from 'vitest';
import { safeNext, signInPath } from '../../src/lib/server/redirects';

describe('redirects after sign-in', () => {
  it.each([
    ['/records?kind=lesson', '/records?kind=lesson'],
    ['/', '/'],
    [null, '/'],
    ['https://evil.example/', '/'],
    ['//evil.example/', '/'],
    ['/\\evil.example', '/'],
    ['/sign-in?next=/x', '/'],
  ])('safeNext(%s) = %s', (input, expected) => {
    expect(safeNext(input)).toBe(expected);
  });

  it('sends the signed-out back where they were going', () => {
    expect(signInPath(new URL('http://h/records/abc?tab=history'))).toBe(
      '/sign-in?next=%2Frecords%2Fabc%3Ftab%3Dhistory',
    );
    expect(signInPath(new URL('http://h/'))).toBe('/sign-in');
  });
});
