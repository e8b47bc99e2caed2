import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { NoticeSettings } from '@/api/contract';
import { NoticeSettingsPanel } from '@/features/notices/components/notice-settings-panel';
import { apiError, jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);

const URL_PATH = '/api/projects/p-1/notice-settings';
const REASON =
  'Red notices cannot be switched off: a red level asks for action within its timeframe, so everyone it concerns is told.';
const defaults: NoticeSettings = {
  projectId: 'p-1',
  submitted: true,
  ruleOverdue: true,
  returned: true,
  confirmedOtherClass: true,
  red: true,
  redLockedReason: REASON,
  updatedAt: null,
};

const renderPanel = () =>
  renderWithProviders(<NoticeSettingsPanel projectId="p-1" projectName="Harrowdale Headrace" />);

describe('Notice settings panel (issue 11 item 4: each person chooses their review e-mails)', () => {
  it('shows every notice switched on by default, and red locked on with the reason', async () => {
    mockApi({ [`GET ${URL_PATH}`]: defaults });
    renderPanel();
    expect(
      screen.getByRole('heading', { name: 'E-mail notices in Harrowdale Headrace' }),
    ).toBeInTheDocument();
    const submitted = await screen.findByRole('switch', { name: 'A round waits for review' });
    expect(submitted).toBeChecked();
    expect(submitted).toBeEnabled();
    expect(submitted).toHaveAccessibleDescription(/when a geologist submits a round/);
    for (const name of [
      'A fired rule ran past its time',
      'My round was returned',
      'My round was confirmed with another class',
    ])
      expect(screen.getByRole('switch', { name })).toBeChecked();
    const red = screen.getByRole('switch', { name: 'Red trigger level (always on)' });
    expect(red).toBeChecked();
    expect(red).toBeDisabled();
    expect(red).toHaveAccessibleDescription(/cannot be switched off/);
  });

  it('saves the whole choice when a switch is flipped (red sent as on) and shows the server’s answer', async () => {
    let sent: unknown = null;
    const api = mockApi({
      [`GET ${URL_PATH}`]: defaults,
      [`PUT ${URL_PATH}`]: async (request: Request) => {
        sent = await request.json();
        return jsonResponse({ ...defaults, submitted: false, updatedAt: '2026-12-03T18:00:00.000Z' });
      },
    });
    const user = userEvent.setup();
    renderPanel();
    await user.click(await screen.findByRole('switch', { name: 'A round waits for review' }));
    expect(await screen.findByRole('status')).toHaveTextContent('Saved');
    expect(sent).toEqual({
      submitted: false,
      ruleOverdue: true,
      returned: true,
      confirmedOtherClass: true,
      red: true,
    });
    expect(screen.getByRole('switch', { name: 'A round waits for review' })).not.toBeChecked();
    expect(screen.getByRole('switch', { name: 'My round was returned' })).toBeChecked();
    expect(requestedRoutes(api)).toEqual([`GET ${URL_PATH}`, `PUT ${URL_PATH}`]);
  });

  it('says so when the save fails, and the switch keeps what the server holds', async () => {
    mockApi({
      [`GET ${URL_PATH}`]: defaults,
      [`PUT ${URL_PATH}`]: apiError(503, 'UNAVAILABLE', 'The database is not reachable.'),
    });
    const user = userEvent.setup();
    renderPanel();
    await user.click(await screen.findByRole('switch', { name: 'My round was returned' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'Saving your notice settings did not work: The database is not reachable.',
    );
    await waitFor(() => expect(screen.getByRole('switch', { name: 'My round was returned' })).toBeEnabled());
    expect(screen.getByRole('switch', { name: 'My round was returned' })).toBeChecked();
    expect(screen.queryByRole('status')).not.toBeInTheDocument();
  });

  it('says so when the settings cannot be read', async () => {
    mockApi({ [`GET ${URL_PATH}`]: apiError(404, 'NOT_FOUND', 'The project was not found.') });
    renderPanel();
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'Reading your notice settings did not work: The project was not found.',
    );
    expect(screen.queryByRole('switch')).not.toBeInTheDocument();
  });
});
