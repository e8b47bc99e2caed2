import { safeNextPath, signInPath } from './next-path';

describe('safeNextPath', () => {
  it('keeps paths inside Roundbook, with their query', () => {
    expect(safeNextPath('/mail')).toBe('/mail');
    expect(safeNextPath('/?project=p-1')).toBe('/?project=p-1');
  });

  it.each([
    null,
    undefined,
    '',
    'mail',
    'https://elsewhere.example/',
    '//elsewhere.example',
    '/\\elsewhere',
    '/sign-in',
  ])('sends %p to the Board instead', (next) => {
    expect(safeNextPath(next)).toBe('/');
  });
});

describe('signInPath', () => {
  it('carries the page to return to and why the person was signed out', () => {
    expect(signInPath('/mail')).toBe('/sign-in?next=%2Fmail');
    expect(signInPath('/mail', 'expired')).toBe('/sign-in?next=%2Fmail&reason=expired');
    expect(signInPath('/')).toBe('/sign-in');
  });

  it('keeps the query string of the page to return to (the handover e-mail’s link)', () => {
    const path = signInPath('/received?handover=ho-1&x=a b');
    expect(path).toBe('/sign-in?next=%2Freceived%3Fhandover%3Dho-1%26x%3Da+b');
    const next = new URLSearchParams(path.split('?')[1]).get('next');
    expect(safeNextPath(next)).toBe('/received?handover=ho-1&x=a b');
  });
});
