import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { SupportRecord, SupportRecordItem } from '@/api/contract';
import { SupportRecordSection } from '@/features/support-records/components/support-record-section';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);

const PATH = '/api/projects/p-1/rounds/r-1/support-record';

const item = (over: Partial<SupportRecordItem> & Pick<SupportRecordItem, 'element'>): SupportRecordItem => ({
  unit: 'count',
  hasLength: false,
  planned: { inClass: false, quantity: null, length: null, text: '' },
  status: 'not-needed',
  quantity: null,
  length: null,
  reason: 'Not an element of class C2.',
  installedBy: null,
  installedByName: null,
  installedAt: null,
  ...over,
});

/** Class C2's plan as the server prefills it (invented library): bolts, sprayed concrete and probing. */
const prefilled = (over: Partial<SupportRecord> = {}): SupportRecord => ({
  roundId: 'r-1',
  headingId: 'h-1',
  roundNumber: 12,
  confirmed: true,
  classId: 'c-2',
  classCode: 'C2',
  className: 'Pattern bolts and sprayed concrete',
  recorded: false,
  version: 0,
  updatedAt: null,
  updatedByName: null,
  outstandingCount: 3,
  items: [
    item({
      element: 'probe-holes',
      hasLength: true,
      status: 'outstanding',
      reason: '',
      planned: { inClass: true, quantity: null, length: null, text: 'Probing required' },
    }),
    item({
      element: 'sprayed-concrete',
      unit: 'mm',
      status: 'outstanding',
      reason: '',
      planned: { inClass: true, quantity: 50, length: null, text: '50 mm' },
    }),
    item({ element: 'mesh', unit: 'm2' }),
    item({
      element: 'bolts',
      hasLength: true,
      status: 'outstanding',
      reason: '',
      planned: { inClass: true, quantity: null, length: 3, text: 'Invented grouted bar, 1.5 m × 1.5 m' },
    }),
    item({ element: 'spiles', hasLength: true }),
    item({ element: 'steel-sets' }),
  ],
  ...over,
});

const section = (canRecord = true) =>
  renderWithProviders(
    <SupportRecordSection projectId="p-1" roundId="r-1" canRecord={canRecord} timeZone="UTC" />,
  );

async function bodiesOf(api: jest.Mock): Promise<unknown[]> {
  const requests = api.mock.calls
    .map(([input]) => input as Request)
    .filter((r) => r.method === 'PUT' && new URL(r.url).pathname === PATH);
  return Promise.all(requests.map((r) => r.clone().json() as Promise<unknown>));
}

describe('SupportRecordSection', () => {
  it('shows the class’s plan and saves what was installed with the version read', async () => {
    const api = mockApi({
      [`GET ${PATH}`]: prefilled(),
      [`PUT ${PATH}`]: () =>
        jsonResponse(
          prefilled({ recorded: true, version: 1, outstandingCount: 2, updatedByName: 'Ola Ferris' }),
        ),
    });
    section();
    const user = userEvent.setup();
    const bolts = await screen.findByRole('group', { name: 'Rock bolts' });
    expect(bolts).toHaveTextContent('Planned (class C2): Invented grouted bar, 1.5 m × 1.5 m, 3 m long');
    expect(screen.getByRole('group', { name: 'Mesh' })).toHaveTextContent('Not named by class C2');
    expect(screen.getByTestId('support-outstanding')).toHaveTextContent('3 outstanding');
    expect(screen.getByText(/Nothing recorded yet/)).toBeInTheDocument();

    const done = within(bolts).getByRole('button', { name: 'Done' });
    expect(done).toHaveStyle({ minHeight: '48px' });
    await user.click(done);
    await user.type(within(bolts).getByRole('textbox', { name: /Bolts installed/ }), '14');
    await user.type(within(bolts).getByRole('textbox', { name: /Length/ }), '3');
    await user.click(screen.getByRole('button', { name: 'Save support record' }));

    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('Saved.'));
    const [body] = (await bodiesOf(api)) as Array<{ version: number; items: Array<Record<string, unknown>> }>;
    expect(body.version).toBe(0);
    expect(body.items).toHaveLength(6);
    expect(body.items[3]).toEqual({ element: 'bolts', status: 'done', quantity: 14, length: 3, reason: '' });
    expect(body.items[2]).toEqual({
      element: 'mesh',
      status: 'not-needed',
      quantity: null,
      length: null,
      reason: 'Not an element of class C2.',
    });
  });

  it('asks for the quantity before done, and sends nothing', async () => {
    const api = mockApi({ [`GET ${PATH}`]: prefilled() });
    section();
    const user = userEvent.setup();
    const sprayed = await screen.findByRole('group', { name: 'Sprayed concrete' });
    await user.click(within(sprayed).getByRole('button', { name: 'Done' }));
    await user.click(screen.getByRole('button', { name: 'Save support record' }));
    expect(
      await within(sprayed).findByText(
        'Sprayed concrete: say how much was installed before marking it done.',
      ),
    ).toBeInTheDocument();
    expect(await bodiesOf(api)).toEqual([]);
  });

  it('shows the server’s words on 400 beside the field and on 409 offers their version', async () => {
    let answer = 400;
    mockApi({
      [`GET ${PATH}`]: prefilled(),
      [`PUT ${PATH}`]: () =>
        answer === 400
          ? jsonResponse(
              {
                code: 'VALIDATION_FAILED',
                message: 'Rock bolts: 400 no. is more than one round takes.',
                fields: { 'items.3.quantity': 'Rock bolts: 400 no. is more than one round takes.' },
              },
              400,
            )
          : jsonResponse(
              {
                code: 'STALE_VERSION',
                message: 'Someone else recorded support on this round since you opened it.',
                details: {
                  current: prefilled({
                    recorded: true,
                    version: 2,
                    updatedByName: 'Ines Marlowe',
                    outstandingCount: 0,
                  }),
                },
              },
              409,
            ),
    });
    section();
    const user = userEvent.setup();
    const bolts = await screen.findByRole('group', { name: 'Rock bolts' });
    await user.type(within(bolts).getByRole('textbox', { name: /Bolts installed/ }), '400');
    await user.click(screen.getByRole('button', { name: 'Save support record' }));
    expect(
      await within(bolts).findByText('Rock bolts: 400 no. is more than one round takes.'),
    ).toBeInTheDocument();

    answer = 409;
    await user.click(screen.getByRole('button', { name: 'Save support record' }));
    expect(await screen.findByTestId('support-problem')).toHaveTextContent(/Someone else recorded support/);
    await user.click(screen.getByRole('button', { name: 'Show their version' }));
    expect(await screen.findByText(/Last recorded by Ines Marlowe/)).toBeInTheDocument();
    expect(screen.queryByTestId('support-problem')).not.toBeInTheDocument();
  });

  it('reads only for those who do not record, and shows nothing before confirmation', async () => {
    mockApi({
      [`GET ${PATH}`]: prefilled({
        recorded: true,
        version: 1,
        items: [
          item({
            element: 'bolts',
            hasLength: true,
            status: 'done',
            quantity: 14,
            length: 3,
            reason: '',
            installedByName: 'Ola Ferris',
            installedAt: '2026-12-03T06:30:00.000Z',
          }),
        ],
      }),
    });
    const view = section(false);
    const bolts = await screen.findByRole('group', { name: 'Rock bolts' });
    expect(bolts).toHaveTextContent('Done · 14 no. × 3 m');
    expect(bolts).toHaveTextContent('Recorded by Ola Ferris');
    expect(screen.queryByRole('button', { name: 'Save support record' })).not.toBeInTheDocument();
    view.unmount();

    mockApi({ [`GET ${PATH}`]: prefilled({ confirmed: false, items: [] }) });
    const { container } = section();
    await waitFor(() => expect(screen.queryByText(/Reading the support record/)).not.toBeInTheDocument());
    expect(container).not.toHaveTextContent('Support as built');
  });
});
