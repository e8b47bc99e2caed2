import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ProjectSettingsForm } from '@/features/projects/components/project-settings-form';
import { harrowdale } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

// jsdom has no ResizeObserver; Fluent's MessageBar (the "saved" notice) measures itself with one.
if (!('ResizeObserver' in window)) {
  Object.assign(window, {
    ResizeObserver: class {
      observe(): void {}
      unobserve(): void {}
      disconnect(): void {}
    },
  });
}

afterEach(restoreFetch);

describe('ProjectSettingsForm: separation of duties', () => {
  it('shows the setting checked with its explanation, and saves it off when unticked', async () => {
    const bodies: unknown[] = [];
    mockApi({
      'PATCH /api/projects/p-1': async (request) => {
        const body = (await request.json()) as Record<string, unknown>;
        bodies.push(body);
        return jsonResponse({ ...harrowdale, ...body, version: 4 });
      },
    });
    renderWithProviders(<ProjectSettingsForm project={harrowdale} canEdit />);
    const user = userEvent.setup();
    const box = screen.getByRole('checkbox', { name: /Separation of duties/ });
    expect(box).toBeChecked();
    expect(screen.getByText(/another engineer of the project confirms it/)).toBeInTheDocument();
    await user.click(box);
    expect(box).not.toBeChecked();
    await user.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(bodies).toHaveLength(1));
    expect(bodies[0]).toMatchObject({ separationOfDuties: false, version: 3 });
  });

  it('is read-only for a member who may not edit the project', () => {
    renderWithProviders(<ProjectSettingsForm project={{ ...harrowdale, role: 'viewer' }} canEdit={false} />);
    expect(screen.getByRole('checkbox', { name: /Separation of duties/ })).toBeDisabled();
  });
});
