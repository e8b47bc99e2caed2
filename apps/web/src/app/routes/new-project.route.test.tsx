import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { CreateProjectRequest, CurrentUser, ProjectSummary } from '@/api/contract';
import { saveSession } from '@/lib/session';
import { adminSession, adminUser, harrowdale, localConfig } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

// jsdom has no ResizeObserver; Fluent's MessageBar measures itself with one.
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
beforeEach(() => saveSession(adminSession));

// An invented project, as the API would answer it.
const tarnside: ProjectSummary = {
  ...harrowdale,
  id: 'p-2',
  code: 'TSD',
  name: 'Tarnside Adit',
  client: 'Fellmoor Mining',
  timeZone: 'Europe/Oslo',
  defaultNotation: 'strike/dip-rhr',
  groundScale: 'iso-14689',
  distributionList: [],
  version: 1,
  headings: [],
};

async function openForm() {
  const user = userEvent.setup();
  const view = renderApp('/projects/new');
  const form = await screen.findByRole('form', { name: 'New project' });
  return { user, form, ...view };
}

describe('New project', () => {
  it('is offered on the Board to anyone signed in', async () => {
    mockApi({
      'GET /api/auth/me': { ...adminUser, memberships: [{ ...adminUser.memberships[0], role: 'viewer' }] },
      'GET /api/config': localConfig,
      'GET /api/projects': [{ ...harrowdale, role: 'viewer' }],
    });
    const user = userEvent.setup();
    const { location } = renderApp('/');
    await user.click(await screen.findByRole('button', { name: 'New project' }));
    expect(await screen.findByRole('form', { name: 'New project' })).toBeInTheDocument();
    expect(location()).toBe('/projects/new');
  });

  it('checks the fields before anything is sent', async () => {
    const fetchMock = mockApi({ 'GET /api/auth/me': adminUser, 'GET /api/config': localConfig });
    const { user, form } = await openForm();
    await user.type(within(form).getByLabelText(/^Project code/), 'two words');
    await user.click(within(form).getByRole('button', { name: 'Create project' }));
    expect(
      await within(form).findByText(
        'Use letters, digits, dots, dashes or underscores, starting with a letter or digit.',
      ),
    ).toBeInTheDocument();
    expect(within(form).getByText('Give the project a name.')).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([r]) => (r as Request).method === 'POST')).toBe(false);
    // Time zones come from the browser's own list.
    const zone = within(form).getByRole('combobox', { name: /^Time zone/ });
    expect(within(zone).getByRole('option', { name: 'Europe/Oslo' })).toBeInTheDocument();
  });

  it('puts the server’s messages on the fields they concern', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'POST /api/projects': () =>
        jsonResponse(
          {
            code: 'CONFLICT',
            message: 'A project with code HHR already exists.',
            fields: { code: 'This code is already used.' },
          },
          409,
        ),
    });
    const { user, form } = await openForm();
    await user.type(within(form).getByLabelText(/^Project code/), 'HHR');
    await user.type(within(form).getByLabelText(/^Project name/), 'Second Harrowdale drive');
    await user.click(within(form).getByRole('button', { name: 'Create project' }));
    expect(await within(form).findByText('This code is already used.')).toBeInTheDocument();
    expect(within(form).getByText('Project not created').closest('[role="alert"]')).toHaveTextContent(
      'A project with code HHR already exists. See the messages under the fields.',
    );
    expect(within(form).getByLabelText(/^Project code/)).toHaveAttribute('aria-invalid', 'true');
  });

  it('creates the project, makes it current and opens its Setup', async () => {
    let sent: CreateProjectRequest | null = null;
    let me: CurrentUser = adminUser;
    mockApi({
      'GET /api/auth/me': () => jsonResponse(me),
      'GET /api/config': localConfig,
      'POST /api/projects': async (request) => {
        sent = (await request.json()) as CreateProjectRequest;
        me = {
          ...adminUser,
          memberships: [
            ...adminUser.memberships,
            { projectId: tarnside.id, projectName: tarnside.name, role: 'admin' },
          ],
        };
        return jsonResponse(tarnside, 201);
      },
      'GET /api/projects/p-2': tarnside,
      'GET /api/projects/p-2/headings': [],
    });
    const { user, form, location } = await openForm();
    await user.type(within(form).getByLabelText(/^Project code/), 'TSD');
    await user.type(within(form).getByLabelText(/^Project name/), 'Tarnside Adit');
    await user.type(within(form).getByLabelText(/^Client/), 'Fellmoor Mining');
    await user.selectOptions(within(form).getByRole('combobox', { name: /^Time zone/ }), 'Europe/Oslo');
    await user.selectOptions(
      within(form).getByRole('combobox', { name: /^Orientation notation/ }),
      'strike/dip-rhr',
    );
    await user.selectOptions(
      within(form).getByRole('combobox', { name: /^Weathering and strength grades/ }),
      'iso-14689',
    );
    await user.click(within(form).getByRole('button', { name: 'Create project' }));

    await waitFor(() => expect(location()).toBe('/setup/headings'));
    expect(sent).toEqual({
      code: 'TSD',
      name: 'Tarnside Adit',
      client: 'Fellmoor Mining',
      timeZone: 'Europe/Oslo',
      defaultNotation: 'strike/dip-rhr',
      groundScale: 'iso-14689',
    });
    expect(await screen.findByTestId('project-created')).toHaveTextContent('Tarnside Adit is ready');
    expect(screen.getByRole('heading', { level: 1, name: 'Setup' })).toBeInTheDocument();
    expect(screen.getByText('Tarnside Adit · what every round is judged against')).toBeInTheDocument();
    // The shell now looks at the new project.
    expect(screen.getByRole('combobox', { name: 'Project' })).toHaveValue('p-2');
    expect(window.localStorage.getItem('roundbook.currentProject')).toBe('p-2');
    expect(screen.getByRole('button', { name: 'Add heading' })).toBeInTheDocument();
  });
});
