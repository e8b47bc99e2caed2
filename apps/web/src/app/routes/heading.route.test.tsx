import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { heading, project } from '@/features/rounds/testing/round-fixtures';
import { saveSession } from '@/lib/session';
import { adminSession, adminUser, localConfig } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

const joints = Array.from({ length: 8 }, (_, i) => ({
  id: `j-${i}`,
  roundId: 'r-1',
  roundNumber: 1,
  faceChainage: 1030,
  kind: 'joint',
  dipDirection: 120 + i,
  dip: 60,
  setLabel: 'S1',
}));

const roundRow = {
  id: 'r-1',
  roundNumber: 1,
  stage: 'full-face',
  faceChainage: 1030,
  shiftDate: '2026-11-30',
  shift: 'day',
  mapperName: 'Ada Quarrington',
  q: 4.2,
  rmr: 58,
  recommendedClassCode: 'B',
  status: 'draft',
  triggerLevel: null,
  triggersNotEvaluated: 0,
};

describe('Heading screen', () => {
  it('opens the Orientation tab on the stereonet of the heading, and goes back to the rounds', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects/p-1': project,
      'GET /api/projects/p-1/headings/h-1': heading,
      'GET /api/projects/p-1/headings/h-1/rounds': () =>
        jsonResponse({ items: [roundRow], total: 1, page: 1, pageSize: 1 }),
      'GET /api/projects/p-1/headings/h-1/joints': joints,
    });
    renderApp('/projects/p-1/headings/h-1');
    const user = userEvent.setup();
    const tab = await screen.findByRole('tab', { name: 'Orientation' });
    expect(tab).toBeEnabled();
    await user.click(tab);
    expect(await screen.findByRole('img', { name: /stereonet: 8 poles/ })).toBeInTheDocument();
    expect(screen.getByRole('form', { name: 'Chainage window' })).toBeInTheDocument();
    await user.click(screen.getByRole('tab', { name: 'Rounds' }));
    await waitFor(() => expect(screen.queryByRole('img', { name: /stereonet/ })).toBeNull());
  });

  it('keeps the view in the address: a reload of ?view=orientation opens the stereonet (issue 19 item 9)', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects/p-1': project,
      'GET /api/projects/p-1/headings/h-1': heading,
      'GET /api/projects/p-1/headings/h-1/rounds': () =>
        jsonResponse({ items: [roundRow], total: 1, page: 1, pageSize: 1 }),
      'GET /api/projects/p-1/headings/h-1/joints': joints,
    });
    renderApp('/projects/p-1/headings/h-1?view=orientation');
    expect(await screen.findByRole('img', { name: /stereonet: 8 poles/ })).toBeInTheDocument();
    expect(screen.getByRole('tab', { name: 'Orientation' })).toHaveAttribute('aria-selected', 'true');
    // No greyed tab for what does not exist yet (it read as active in high contrast, item 12).
    expect(screen.queryByRole('tab', { name: /coming/ })).toBeNull();
  });

  it('opens the Hazards tab on the heading’s register', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects/p-1': project,
      'GET /api/projects/p-1/headings/h-1': heading,
      'GET /api/projects/p-1/headings/h-1/rounds': () =>
        jsonResponse({ items: [roundRow], total: 1, page: 1, pageSize: 1 }),
      'GET /api/projects/p-1/headings/h-1/hazards': [],
    });
    renderApp('/projects/p-1/headings/h-1');
    const user = userEvent.setup();
    const tab = await screen.findByRole('tab', { name: 'Hazards' });
    expect(tab).toBeEnabled();
    await user.click(tab);
    expect(await screen.findByText('No open hazard on this heading')).toBeInTheDocument();
  });
});
