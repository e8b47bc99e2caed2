import { shouldRevalidate } from '@/app/routes/round.route';

const args = (current: string, next: string) =>
  ({
    currentUrl: new URL(current, 'http://127.0.0.1'),
    nextUrl: new URL(next, 'http://127.0.0.1'),
    defaultShouldRevalidate: true,
  }) as Parameters<typeof shouldRevalidate>[0];

describe('round route revalidation', () => {
  it('does not load the round again when only the section in the address changes', () => {
    expect(shouldRevalidate(args('/projects/p/rounds/r', '/projects/p/rounds/r?section=rating'))).toBe(false);
    expect(shouldRevalidate(args('/projects/p/rounds/r?section=rating', '/projects/p/rounds/r'))).toBe(false);
  });

  it('follows the default for another round or another query', () => {
    expect(shouldRevalidate(args('/projects/p/rounds/r', '/projects/p/rounds/s?section=rating'))).toBe(true);
    expect(shouldRevalidate(args('/projects/p/rounds/r', '/projects/p/rounds/r?revision=2'))).toBe(true);
  });
});
