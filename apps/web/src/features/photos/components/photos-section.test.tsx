import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { pinsOf } from '../hooks/use-photo-pins';
import { PhotosSection } from './photos-section';
import type { Photo } from '@/api/resources/photos';
import { saveSession } from '@/lib/session';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

const BASE = '/api/projects/p-1/rounds/r-1/photos';

const stored = (over: Partial<Photo>): Photo => ({
  id: 'ph-1',
  roundId: 'r-1',
  uploadState: 'stored',
  variantState: 'ready',
  contentType: 'image/jpeg',
  size: 10,
  originalName: 'IMG_1.JPG',
  caption: '',
  facePart: null,
  takenAt: '2026-11-30T06:45:12.000Z',
  uploadedBy: 'u-1',
  uploadedByName: 'Invented Geologist',
  pinX: null,
  pinY: null,
  scale: null,
  width: 1500,
  height: 2000,
  createdAt: '2026-11-30T07:00:00.000Z',
  ...over,
});

/** The parts go by XMLHttpRequest: a stand-in that reports progress and answers from a script. */
class FakeXhr {
  static sent: Array<{ url: string; size: number }> = [];
  static failNext = 0;
  upload: { onprogress: ((e: { loaded: number }) => void) | null } = { onprogress: null };
  onload: (() => void) | null = null;
  onerror: (() => void) | null = null;
  onabort: (() => void) | null = null;
  status = 0;
  responseText = '';
  private url = '';
  open(_method: string, url: string) {
    this.url = url;
  }
  setRequestHeader() {}
  getResponseHeader() {
    return null;
  }
  abort() {}
  send(body: Blob) {
    queueMicrotask(() => {
      this.upload.onprogress?.({ loaded: Math.floor(body.size / 2) });
      if (FakeXhr.failNext > 0) {
        FakeXhr.failNext--;
        this.onerror?.();
        return;
      }
      FakeXhr.sent.push({ url: this.url, size: body.size });
      this.status = 200;
      const n = Number(this.url.split('/').pop());
      this.responseText = JSON.stringify({ partNumber: n, etag: `"etag-${n}"` });
      this.onload?.();
    });
  }
}

const realXhr = globalThis.XMLHttpRequest;
beforeEach(() => {
  saveSession(adminSession);
  FakeXhr.sent = [];
  FakeXhr.failNext = 0;
  globalThis.XMLHttpRequest = FakeXhr as unknown as typeof XMLHttpRequest;
});
afterEach(() => {
  restoreFetch();
  globalThis.XMLHttpRequest = realXhr;
});

describe('PhotosSection', () => {
  it('refuses a wrong type and an oversize file before sending anything', async () => {
    const api = mockApi({ [`GET ${BASE}`]: [] });
    renderWithProviders(<PhotosSection projectId="p-1" roundId="r-1" canEdit />);
    expect(await screen.findByText('No photos of this round yet.')).toBeInTheDocument();
    const input = screen.getByLabelText('Photo files');
    const pdf = new File(['%PDF-1.7'], 'report.pdf', { type: 'application/pdf' });
    const huge = new File(['x'], 'huge.jpg', { type: 'image/jpeg' });
    Object.defineProperty(huge, 'size', { value: 26 * 1024 * 1024 });
    await userEvent.setup({ applyAccept: false }).upload(input, [pdf, huge]);
    expect(
      screen.getByText('report.pdf is not a JPEG, PNG, WebP or HEIC photo. Not sent.'),
    ).toBeInTheDocument();
    expect(
      screen.getByText('huge.jpg is 26.0 MB; a photo can be at most 25 MB. Not sent.'),
    ).toBeInTheDocument();
    expect(requestedRoutes(api).filter((r) => r.startsWith('POST'))).toEqual([]);
    expect(FakeXhr.sent).toEqual([]);
  });

  it('uploads in parts with progress, retries a failed file without re-sending its stored parts, then shows it in the gallery', async () => {
    const bytes = new Uint8Array(25); // 3 parts of 10 bytes (the API decides the part size)
    const file = new File([bytes], 'face.jpg', { type: 'image/jpeg' });
    let listed: Photo[] = [];
    const api = mockApi({
      [`GET ${BASE}`]: () => jsonResponse(listed),
      [`POST ${BASE}`]: () =>
        jsonResponse(
          {
            photo: stored({ uploadState: 'uploading', variantState: 'pending' }),
            partSize: 10,
            partCount: 3,
            maxBytes: 26214400,
          },
          201,
        ),
      [`POST ${BASE}/ph-1/complete`]: async (request) => {
        const body = (await request.json()) as { parts: unknown[] };
        expect(body.parts).toEqual([
          { partNumber: 1, etag: '"etag-1"' },
          { partNumber: 2, etag: '"etag-2"' },
          { partNumber: 3, etag: '"etag-3"' },
        ]);
        listed = [stored({ variantState: 'pending', caption: '' })];
        return jsonResponse(listed[0]);
      },
      [`GET ${BASE}/ph-1/url`]: (request) =>
        jsonResponse({
          url: `http://storage.test/${new URL(request.url).searchParams.get('variant')}.jpg`,
          variant: 'original',
          expiresAt: '2026-11-30T07:05:00.000Z',
        }),
    });
    renderWithProviders(<PhotosSection projectId="p-1" roundId="r-1" canEdit />);
    await screen.findByText('No photos of this round yet.');
    const user = userEvent.setup();

    // The connection drops on the second part.
    FakeXhr.sent = [];
    const realSend = FakeXhr.prototype.send;
    let calls = 0;
    FakeXhr.prototype.send = function (this: FakeXhr, body: Blob) {
      calls++;
      if (calls === 2) FakeXhr.failNext = 1;
      realSend.call(this, body);
    };
    await user.upload(screen.getByLabelText('Photo files'), file);
    const retry = await screen.findByRole('button', { name: 'Try again' });
    expect(screen.getByText('The Roundbook server could not be reached.')).toBeInTheDocument();
    expect(screen.getByText('face.jpg: 40 %')).toBeInTheDocument();
    expect(FakeXhr.sent.map((s) => s.url.split('/').pop())).toEqual(['1']);
    FakeXhr.prototype.send = realSend;

    await user.click(retry);
    await waitFor(() => expect(screen.getByText('face.jpg: added')).toBeInTheDocument());
    // Part 1 went once; 2 and 3 after the retry; one upload was started.
    expect(FakeXhr.sent.map((s) => [s.url.split('/').pop(), s.size])).toEqual([
      ['1', 10],
      ['2', 10],
      ['3', 5],
    ]);
    expect(requestedRoutes(api).filter((r) => r === `POST ${BASE}`)).toHaveLength(1);
    expect(screen.getByText('All photos: 100 %')).toBeInTheDocument();

    // The gallery shows it from its original while the thumbnail is made.
    const img = await screen.findByRole('img', { name: 'IMG_1.JPG' });
    expect(img).toHaveAttribute('src', 'http://storage.test/thumbnail.jpg');
    expect(screen.getByText(/thumbnail being made/)).toBeInTheDocument();
  });

  it('saves the part of the face and opens the full-screen viewer; readers get no edit controls', async () => {
    const patches: unknown[] = [];
    mockApi({
      [`GET ${BASE}`]: [stored({ caption: 'Shear zone' }), stored({ id: 'ph-2', originalName: 'IMG_2.JPG' })],
      [`GET ${BASE}/ph-1/url`]: { url: 'http://storage.test/1.jpg', variant: 'display', expiresAt: 'x' },
      [`GET ${BASE}/ph-2/url`]: { url: 'http://storage.test/2.jpg', variant: 'display', expiresAt: 'x' },
      [`PATCH ${BASE}/ph-1`]: async (request) => {
        patches.push(await request.json());
        return jsonResponse(stored({ caption: 'Shear zone', facePart: 'crown' }));
      },
    });
    const view = renderWithProviders(<PhotosSection projectId="p-1" roundId="r-1" canEdit />);
    const user = userEvent.setup();
    const selects = await screen.findAllByRole('combobox', { name: 'Part of the face' });
    await user.selectOptions(selects[0], 'crown');
    await waitFor(() => expect(patches).toEqual([{ facePart: 'crown' }]));

    await user.click(screen.getByRole('button', { name: 'Open Shear zone' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText('1 of 2')).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Next photo' }));
    expect(within(dialog).getByText('2 of 2')).toBeInTheDocument();
    expect(within(dialog).getByRole('img', { name: 'IMG_2.JPG' })).toHaveAttribute(
      'src',
      'http://storage.test/2.jpg',
    );
    await user.click(within(dialog).getByRole('button', { name: 'Close' }));
    view.unmount();

    renderWithProviders(<PhotosSection projectId="p-1" roundId="r-1" canEdit={false} />);
    expect(await screen.findByText('Shear zone')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Add photos' })).not.toBeInTheDocument();
    expect(screen.queryByRole('combobox')).not.toBeInTheDocument();
  });
});

describe('pins on the sketch', () => {
  it('numbers the pins as the gallery numbers its photos, skipping photos without one', () => {
    expect(
      pinsOf([
        stored({ id: 'a', pinX: -1.5, pinY: 2 }),
        stored({ id: 'b' }),
        stored({ id: 'c', caption: 'Crown wedge', pinX: 0.25, pinY: 4.1 }),
      ]),
    ).toEqual([
      { photoId: 'a', number: 1, at: [-1.5, 2], label: 'IMG_1.JPG' },
      { photoId: 'c', number: 3, at: [0.25, 4.1], label: 'Crown wedge' },
    ]);
  });

  it('asks the round page to pin a photo, shows a pinned one as pinned and removes its pin', async () => {
    const patches: unknown[] = [];
    mockApi({
      [`GET ${BASE}`]: [stored({}), stored({ id: 'ph-2', originalName: 'IMG_2.JPG', pinX: 1, pinY: 2 })],
      [`GET ${BASE}/ph-1/url`]: { url: 'http://storage.test/1.jpg', variant: 'thumbnail', expiresAt: 'x' },
      [`GET ${BASE}/ph-2/url`]: { url: 'http://storage.test/2.jpg', variant: 'thumbnail', expiresAt: 'x' },
      [`PATCH ${BASE}/ph-2`]: async (request) => {
        patches.push(await request.json());
        return jsonResponse(stored({ id: 'ph-2' }));
      },
    });
    const onPin = jest.fn();
    renderWithProviders(<PhotosSection projectId="p-1" roundId="r-1" canEdit onPinOnSketch={onPin} />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Pin on the sketch' }));
    expect(onPin).toHaveBeenCalledWith(expect.objectContaining({ id: 'ph-1' }), '1 · IMG_1.JPG');
    expect(screen.getByText('Pinned on the sketch · 2')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Move the pin' }));
    expect(onPin).toHaveBeenLastCalledWith(expect.objectContaining({ id: 'ph-2' }), '2 · IMG_2.JPG');
    await user.click(screen.getByRole('button', { name: 'Remove the pin of IMG_2.JPG' }));
    await waitFor(() => expect(patches).toEqual([{ pinX: null, pinY: null }]));
  });
});
