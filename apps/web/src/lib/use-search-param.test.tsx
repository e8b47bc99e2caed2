import { act, renderHook } from '@testing-library/react';
import type { ReactNode } from 'react';
import { MemoryRouter, useLocation } from 'react-router-dom';
import { useSearchParam } from '@/lib/use-search-param';

function setup(initial: string) {
  const wrapper = ({ children }: { children: ReactNode }) => (
    <MemoryRouter initialEntries={[initial]}>{children}</MemoryRouter>
  );
  return renderHook(
    () => {
      const [value, set] = useSearchParam('section', 'position');
      return { value, set, location: useLocation() };
    },
    { wrapper },
  );
}

describe('useSearchParam', () => {
  it('reads the parameter, writes it replacing the entry, and leaves the fallback out of the address', () => {
    const { result } = setup('/rounds/r?page=2');
    expect(result.current.value).toBeNull();
    act(() => result.current.set('rating'));
    expect(result.current.value).toBe('rating');
    expect(result.current.location.search).toBe('?page=2&section=rating');
    act(() => result.current.set('position'));
    expect(result.current.location.search).toBe('?page=2');
  });

  it('does not navigate when the value is already there (an effect reporting it cannot loop)', () => {
    const { result } = setup('/rounds/r?section=joints');
    const before = result.current.location.key;
    act(() => result.current.set('joints'));
    expect(result.current.location.key).toBe(before);
    const first = result.current.location.key;
    act(() => result.current.set('position'));
    expect(result.current.location.key).not.toBe(first);
    expect(result.current.location.search).toBe('');
  });
});
