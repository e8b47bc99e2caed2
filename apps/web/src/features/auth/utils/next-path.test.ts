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
});
