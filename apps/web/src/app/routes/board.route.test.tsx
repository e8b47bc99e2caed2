import { screen, waitFor, within } from '@testing-library/react';
import { saveSession } from '@/lib/session';
import { adminSession, adminUser, harrowdale, localConfig, viewerUser } from '@/testing/fixtures';
import { mockApi, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);

describe('Board', () => {
  beforeEach(() => saveSession(adminSession));

  it('shows each project with one card per heading, as the API describes them', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects': [harrowdale],
    });
    renderApp('/');

    const board = await screen.findByRole('region', { name: 'Harrowdale Headrace' });
    expect(within(board).getByRole('heading', { level: 1, name: 'Harrowdale Headrace' })).toBeInTheDocument();
    expect(board).toHaveTextContent('HHR · for Lowmere Water Board · times in UTC');

    const cards = within(board).getAllByRole('article');
    expect(cards).toHaveLength(2);

    const upstream = within(board).getByRole('article', { name: 'Upstream drive from Adit 2' });
    expect(upstream).toHaveTextContent('HR-U');
    expect(upstream).toHaveTextContent('1+250.0');
    // A draft's face is shown apart, so a typo in a draft does not move the face (issue 19, item 13).
    expect(upstream).toHaveTextContent('Draft at 1+253.5, not yet submitted');
    expect(upstream).toHaveTextContent('Trigger: Amber');
    expect(upstream).toHaveTextContent('047°, rising +0.40 %');
    expect(upstream).toHaveTextContent('Top heading');
    expect(upstream).toHaveTextContent('Bench');
    expect(upstream).toHaveTextContent('30 Nov 2026, 21:40');
    expect(upstream).toHaveTextContent('2 rounds');
    expect(upstream).toHaveTextContent('sent 30 Nov 2026, 18:05');
    expect(within(upstream).getByTestId('handover-state')).toHaveTextContent(
      'Waiting for acknowledgement, due by 30 Nov 2026, 19:05',
    );
    // The last handover leads to the heading's Handovers tab (issue 15 item 6).
    expect(within(upstream).getByRole('link', { name: 'sent 30 Nov 2026, 18:05' })).toHaveAttribute(
      'href',
      '/projects/p-1/headings/h-1?view=handovers',
    );
    // Not an engineer: the count leads to the heading's rounds handed in, not to an empty queue.
    expect(within(upstream).getByRole('link', { name: '2 rounds' })).toHaveAttribute(
      'href',
      '/projects/p-1/headings/h-1?status=submitted',
    );
    // Support as built (issue 15, item 2): the last confirmed round still has support outstanding.
    expect(within(upstream).getByTestId('support-outstanding')).toHaveTextContent(
      'outstanding on the last confirmed round',
    );

    // The class being built: confirmed on the heading's most recently confirmed round.
    expect(within(upstream).getByTestId('confirmed-class')).toHaveTextContent(
      'B, confirmed on round 41 (top heading)',
    );

    const downstream = within(board).getByRole('article', { name: 'Downstream drive from Adit 2' });
    expect(downstream).toHaveTextContent('Support classnone confirmed yet');
    // Each heading's own chainage style (this one writes metres).
    expect(downstream).toHaveTextContent('no rounds yet (starts at 1000.0)');
    expect(downstream).toHaveTextContent('Support as builtnothing outstanding');
    expect(within(downstream).queryByTestId('support-outstanding')).not.toBeInTheDocument();
    expect(downstream).toHaveTextContent('No trigger level yet');
    expect(downstream).toHaveTextContent('227°, falling −0.40 %');
    expect(within(downstream).getAllByText('none yet')).toHaveLength(2);
  });

  it('puts the caution on the page and builds the navigation from the role', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/local/access': { localMode: true, operator: true },
      'GET /api/projects': [harrowdale],
    });
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    await waitFor(() =>
      expect(
        within(nav)
          .getAllByRole('link')
          .map((l) => l.textContent),
      ).toEqual(['Board', 'Setup', 'Local mail']),
    );
    expect(screen.getByTestId('caution-note')).toHaveTextContent('Nobody goes under unsupported ground.');
    expect(screen.getAllByText('Project admin')).toHaveLength(2);
  });

  it('does not offer Local mail to a project admin who does not run this instance', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/local/access': { localMode: true, operator: false },
      'GET /api/projects': [harrowdale],
    });
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    await screen.findByRole('button', { name: 'New project' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((l) => l.textContent),
    ).toEqual(['Board', 'Setup']);
  });

  it('hides New project where only the people who run Roundbook create projects', async () => {
    mockApi({
      'GET /api/auth/me': { ...adminUser, canCreateProjects: false },
      'GET /api/config': localConfig,
      'GET /api/projects': [harrowdale],
    });
    renderApp('/');
    expect(await screen.findByRole('article', { name: 'Upstream drive from Adit 2' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'New project' })).not.toBeInTheDocument();
  });

  it('says who creates projects when the person has none and may not create one', async () => {
    mockApi({
      'GET /api/auth/me': { ...adminUser, memberships: [], canCreateProjects: false },
      'GET /api/config': localConfig,
      'GET /api/projects': [],
    });
    renderApp('/');
    const empty = await screen.findByRole('region', { name: 'You are not on a project yet' });
    expect(empty).toHaveTextContent('the people who run it create projects');
    expect(screen.queryByRole('button', { name: 'New project' })).not.toBeInTheDocument();
  });

  it('offers a viewer the Board and a read-only Setup', async () => {
    mockApi({
      'GET /api/auth/me': viewerUser,
      'GET /api/config': localConfig,
      'GET /api/projects': [{ ...harrowdale, role: 'viewer' }],
    });
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((l) => l.textContent),
    ).toEqual(['Board', 'Setup']);
    expect(await screen.findAllByText('Read only')).not.toHaveLength(0);
    // New project follows the API's rule (PROJECT_CREATION), which here lets anyone create one.
    expect(screen.getByRole('button', { name: 'New project' })).toBeInTheDocument();
  });

  it('does not offer a viewer New project where the API would refuse it', async () => {
    mockApi({
      'GET /api/auth/me': { ...viewerUser, canCreateProjects: false },
      'GET /api/config': localConfig,
      'GET /api/projects': [{ ...harrowdale, role: 'viewer' }],
    });
    renderApp('/');
    expect(await screen.findByRole('article', { name: 'Upstream drive from Adit 2' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'New project' })).not.toBeInTheDocument();
  });

  it('says so when the person has no project yet', async () => {
    mockApi({
      'GET /api/auth/me': { ...adminUser, memberships: [] },
      'GET /api/config': localConfig,
      'GET /api/projects': [],
    });
    renderApp('/');
    expect(await screen.findByRole('region', { name: 'You are not on a project yet' })).toBeInTheDocument();
  });

  it('shows a readable error inside the shell when the projects cannot be loaded', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
    renderApp('/');
    expect(await screen.findByRole('alert')).toHaveTextContent('Roundbook server not reachable');
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeInTheDocument();
  });
});
