import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { PhotoViewer } from './photo-viewer';
import { facePartLabels } from './photos-section';
import type { Photo } from '@/api/resources/photos';
import { saveSession } from '@/lib/session';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

const BASE = '/api/projects/p-1/rounds/r-1/photos';

const photo = (n: number, over: Partial<Photo> = {}): Photo => ({
  id: `ph-${n}`,
  roundId: 'r-1',
  uploadState: 'stored',
  variantState: 'ready',
  contentType: 'image/jpeg',
  size: 10,
  originalName: `IMG_${n}.JPG`,
  caption: '',
  facePart: null,
  takenAt: null,
  uploadedBy: 'u-1',
  uploadedByName: null,
  pinX: null,
  pinY: null,
  scale: null,
  width: 1600,
  height: 1200,
  createdAt: '2026-11-30T07:00:00.000Z',
  ...over,
});

// jsdom has no PointerEvent: a MouseEvent with a pointer id stands in (what the viewer reads).
class FakePointerEvent extends MouseEvent {
  pointerId: number;
  constructor(type: string, init: PointerEventInit = {}) {
    super(type, init);
    this.pointerId = init.pointerId ?? 1;
  }
}
const realPointer = globalThis.PointerEvent;

beforeEach(() => {
  saveSession(adminSession);
  globalThis.PointerEvent = FakePointerEvent as unknown as typeof PointerEvent;
});
afterEach(() => {
  restoreFetch();
  globalThis.PointerEvent = realPointer;
});

function mockUrls(count: number, extra: Record<string, unknown> = {}) {
  const routes: Record<string, unknown> = { ...extra };
  for (let n = 1; n <= count; n++)
    routes[`GET ${BASE}/ph-${n}/url`] = {
      url: `http://storage.test/${n}.jpg`,
      variant: 'display',
      expiresAt: 'x',
    };
  return mockApi(routes as Parameters<typeof mockApi>[0]);
}

/** The viewer with its index kept like the section keeps it. */
function Harness({
  photos,
  canEdit = false,
  onClose = () => {},
}: {
  photos: Photo[];
  canEdit?: boolean;
  onClose?: () => void;
}) {
  const [index, setIndex] = useState(0);
  return (
    <PhotoViewer
      at={{ projectId: 'p-1', roundId: 'r-1' }}
      photos={photos}
      index={index}
      onIndex={setIndex}
      onClose={onClose}
      canEdit={canEdit}
      facePartLabels={facePartLabels}
    />
  );
}
const swipe = (el: Element, fromX: number, toX: number, y = 200) => {
  fireEvent.pointerDown(el, { pointerId: 1, clientX: fromX, clientY: y });
  fireEvent.pointerMove(el, { pointerId: 1, clientX: (fromX + toX) / 2, clientY: y });
  fireEvent.pointerUp(el, { pointerId: 1, clientX: toX, clientY: y });
};
const tap = (el: Element, x: number, y: number) => {
  fireEvent.pointerDown(el, { pointerId: 1, clientX: x, clientY: y });
  fireEvent.pointerUp(el, { pointerId: 1, clientX: x, clientY: y });
};

describe('PhotoViewer', () => {
  it('goes between photos with the arrow keys and the buttons, wrapping round, and closes on Escape', async () => {
    mockUrls(3);
    const onClose = jest.fn();
    renderWithProviders(<Harness photos={[photo(1), photo(2), photo(3)]} onClose={onClose} />);
    const dialog = await screen.findByRole('dialog', { hidden: true });
    expect(within(dialog).getByText('1 of 3')).toBeInTheDocument();
    fireEvent.keyDown(dialog, { key: 'ArrowRight' });
    expect(within(dialog).getByText('2 of 3')).toBeInTheDocument();
    fireEvent.keyDown(dialog, { key: 'ArrowLeft' });
    fireEvent.keyDown(dialog, { key: 'ArrowLeft' });
    expect(within(dialog).getByText('3 of 3')).toBeInTheDocument();
    await userEvent.click(within(dialog).getByRole('button', { name: 'Next photo', hidden: true }));
    expect(within(dialog).getByText('1 of 3')).toBeInTheDocument();
    expect(await within(dialog).findByRole('img', { name: 'IMG_1.JPG', hidden: true })).toHaveAttribute(
      'src',
      'http://storage.test/1.jpg',
    );
    expect(onClose).not.toHaveBeenCalled();
    fireEvent.keyDown(within(dialog).getByRole('button', { name: 'Next photo', hidden: true }), {
      key: 'Escape',
    });
    await waitFor(() => expect(onClose).toHaveBeenCalledTimes(1));
  });

  it('swipes left to the next photo and right to the previous; a short drag or a zoomed photo does not turn', async () => {
    mockUrls(3);
    renderWithProviders(<Harness photos={[photo(1), photo(2), photo(3)]} />);
    const dialog = await screen.findByRole('dialog', { hidden: true });
    const stage = within(dialog).getByTestId('photo-stage');
    swipe(stage, 300, 180);
    expect(within(dialog).getByText('2 of 3')).toBeInTheDocument();
    swipe(stage, 100, 260);
    expect(within(dialog).getByText('1 of 3')).toBeInTheDocument();
    swipe(stage, 300, 280);
    expect(within(dialog).getByText('1 of 3')).toBeInTheDocument();
    // Zoomed in with the button: the same swipe pans instead.
    await userEvent.click(within(dialog).getByRole('button', { name: 'Zoom in', hidden: true }));
    swipe(stage, 300, 180);
    expect(within(dialog).getByText('1 of 3')).toBeInTheDocument();
  });

  it('marks a scale with two taps and a distance, and shows the scale bar of a photo that has one', async () => {
    const patches: unknown[] = [];
    const withScale = photo(1, { scale: { a: { x: 0.1, y: 0.5 }, b: { x: 0.6, y: 0.5 }, distanceM: 1.2 } });
    mockUrls(1, {
      [`PATCH ${BASE}/ph-1`]: async (request: Request) => {
        patches.push(await request.json());
        return jsonResponse(withScale);
      },
    });
    const { unmount } = renderWithProviders(<Harness photos={[photo(1)]} canEdit />);
    const dialog = await screen.findByRole('dialog', { hidden: true });
    const img = await within(dialog).findByRole('img', { name: 'IMG_1.JPG', hidden: true });
    img.getBoundingClientRect = () => ({
      left: 100,
      top: 50,
      width: 400,
      height: 300,
      right: 500,
      bottom: 350,
      x: 100,
      y: 50,
      toJSON: () => ({}),
    });
    expect(within(dialog).getByText('No scale marked')).toBeInTheDocument();
    await userEvent.click(within(dialog).getByRole('button', { name: 'Mark a scale', hidden: true }));
    const stage = within(dialog).getByTestId('photo-stage');
    expect(within(dialog).getByText('Tap one end of a length you know on the photo.')).toBeInTheDocument();
    tap(stage, 140, 200);
    expect(within(dialog).getByText('Now tap the other end.')).toBeInTheDocument();
    tap(stage, 340, 200);
    expect(within(dialog).getAllByRole('img', { name: /Scale point/, hidden: true })).toHaveLength(2);
    const save = within(dialog).getByRole('button', { name: 'Save the scale', hidden: true });
    expect(save).toBeDisabled();
    await userEvent.type(within(dialog).getByRole('spinbutton', { hidden: true }), '1.2');
    await userEvent.click(save);
    await waitFor(() =>
      expect(patches).toEqual([{ scale: { a: { x: 0.1, y: 0.5 }, b: { x: 0.6, y: 0.5 }, distanceM: 1.2 } }]),
    );
    // the marking's buttons are gone: the photo holds the focus, so Escape and the arrows still work
    await waitFor(() => expect(stage).toHaveFocus());
    unmount();

    // 1.2 m over half the width: the photo is 2.4 m wide, the bar 0.5 m, 0.5 / 2.4 of the width.
    renderWithProviders(<Harness photos={[withScale]} />);
    const bar = await screen.findByRole('img', { name: 'Scale bar 0.5 m', hidden: true });
    expect(bar.style.width).toBe(`${(0.5 / 2.4) * 100}%`);
    expect(within(bar).getByText('0.5 m')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Mark a scale', hidden: true })).not.toBeInTheDocument();
  });
});
