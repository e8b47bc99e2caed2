import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { mockApi, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);

function themeRoot(): HTMLElement {
  const root = document.querySelector<HTMLElement>('[data-theme-mode]');
  if (root === null) throw new Error('no themed root');
  return root;
}

describe('High-contrast switch', () => {
  it('switches the theme and remembers the choice on this device', async () => {
    mockApi({});
    const first = renderApp('/sign-in');
    const toggle = await screen.findByRole('switch', { name: 'High contrast' });
    expect(toggle).not.toBeChecked();
    expect(themeRoot()).toHaveAttribute('data-theme-mode', 'light');

    await userEvent.setup().click(toggle);
    expect(toggle).toBeChecked();
    expect(themeRoot()).toHaveAttribute('data-theme-mode', 'high-contrast');
    expect(window.localStorage.getItem('roundbook.theme')).toBe('high-contrast');
    first.unmount();

    renderApp('/sign-in');
    expect(await screen.findByRole('switch', { name: 'High contrast' })).toBeChecked();
    expect(themeRoot()).toHaveAttribute('data-theme-mode', 'high-contrast');
  });

  it('switches back to the light theme', async () => {
    window.localStorage.setItem('roundbook.theme', 'high-contrast');
    mockApi({});
    renderApp('/sign-in');
    await userEvent.setup().click(await screen.findByRole('switch', { name: 'High contrast' }));
    expect(themeRoot()).toHaveAttribute('data-theme-mode', 'light');
    expect(window.localStorage.getItem('roundbook.theme')).toBe('light');
  });
});
