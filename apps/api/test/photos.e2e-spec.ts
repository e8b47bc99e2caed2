import type { INestApplication } from '@nestjs/common';
import exifr from 'exifr';
import sharp from 'sharp';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { Job } from '../src/infrastructure/jobs/job.entity';
import { JobsWorker } from '../src/infrastructure/jobs/jobs.worker';
import { StorageService } from '../src/infrastructure/storage/storage.service';
import { Photo } from '../src/modules/photos/photo.entity';
import { makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const run = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 5)}`.toUpperCase();
const MiB = 1024 * 1024;

/**
 * A real JPEG over 5 MiB (so it takes two parts of the default 5 MiB) stored 2800×2100 with EXIF
 * orientation 6 (shown turned 90° clockwise: 2100×2800) and a DateTimeOriginal with its offset. Noise keeps
 * it large; a red block in the stored top-left corner shows where the rotation put it.
 */
async function exifJpeg(): Promise<Buffer> {
  const width = 2800;
  const height = 2100;
  const raw = Buffer.alloc(width * height * 3);
  let seed = 7;
  for (let i = 0; i < raw.length; i++) {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    raw[i] = seed >> 23;
  }
  for (let y = 0; y < 300; y++) for (let x = 0; x < 400; x++) raw.set([255, 0, 0], (y * width + x) * 3);
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 100 })
    .withExif({ IFD2: { DateTimeOriginal: '2026:11:30 07:45:12', OffsetTimeOriginal: '+01:00' } })
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

describe('Photos (e2e, S3 fake)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let other: TestProject;
  let roundId: string;
  let submittedId: string;

  const photosOf = (id: string) => `${p.base}/rounds/${id}/photos`;

  /** Runs due jobs in this process until the photo's variants job is done (no sleeps: each tick waits for its jobs). */
  async function runVariantsJob(photoId: string): Promise<Job> {
    const worker = app.get(JobsWorker);
    const jobs = app.get(DataSource).getRepository(Job);
    for (let i = 0; i < 20; i++) {
      await worker.tick();
      await worker.idle();
      const job = await jobs.findOne({ where: { dedupeKey: `photo-variants:${photoId}` } });
      if (job && (job.state === 'done' || job.state === 'dead')) return job;
    }
    throw new Error('the variants job did not finish');
  }

  async function newRound(chainage: number): Promise<string> {
    const r = await request(http)
      .post(`${p.base}/headings/${p.headingId}/rounds`)
      .set(p.as('geologist'))
      .send({ stage: 'full-face', faceChainage: chainage })
      .expect(201);
    return (r.body as Body).id as string;
  }

  /** Start, send the parts (from the sizes the API gave), complete. */
  async function upload(id: string, bytes: Buffer, name: string, type: string) {
    const started = await request(http)
      .post(photosOf(id))
      .set(p.as('geologist'))
      .send({ fileName: name, contentType: type, size: bytes.length })
      .expect(201);
    const { photo, partSize, partCount } = started.body as Body;
    const parts: Body[] = [];
    for (let n = 1; n <= partCount; n++) {
      const chunk = bytes.subarray((n - 1) * partSize, n * partSize);
      const res = await request(http)
        .put(`${photosOf(id)}/${photo.id}/parts/${n}`)
        .set(p.as('geologist'))
        .set('Content-Type', 'application/octet-stream')
        .send(chunk)
        .expect(200);
      parts.push(res.body as Body);
    }
    const done = await request(http)
      .post(`${photosOf(id)}/${photo.id}/complete`)
      .set(p.as('geologist'))
      .send({ parts });
    return { photoId: photo.id as string, partCount: partCount as number, done };
  }

  beforeAll(async () => {
    app = await createTestApp((c) => ({ ...c, jobs: { ...c.jobs, workerEnabled: false } }));
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code: `PH${run}` });
    other = await makeProject(app, { code: `PO${run}` });
    roundId = await newRound(1003);
    submittedId = await newRound(1006);
    await app.get(DataSource).query(`UPDATE rounds SET status = 'submitted' WHERE id = ?`, [submittedId]);
  });

  afterAll(async () => {
    await app?.close();
  });

  it('uploads a JPEG in two parts; the job makes an upright thumbnail and display size and reads the time taken', async () => {
    const jpeg = await exifJpeg();
    expect(jpeg.length).toBeGreaterThan(5 * MiB);
    // The fixture itself carries what the job must read.
    expect(
      await exifr.parse(jpeg, { pick: ['Orientation', 'DateTimeOriginal'], reviveValues: false }),
    ).toEqual({ Orientation: 'Rotate 90 CW', DateTimeOriginal: '2026:11:30 07:45:12' });

    const { photoId, partCount, done } = await upload(roundId, jpeg, 'IMG_0042.JPG', 'image/jpeg');
    expect(partCount).toBe(2);
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({
      id: photoId,
      contentType: 'image/jpeg',
      size: jpeg.length,
      variantState: 'pending',
    });

    // While the thumbnail is being made, the thumbnail address serves the original.
    const early = await request(http)
      .get(`${photosOf(roundId)}/${photoId}/url?variant=thumbnail`)
      .set(p.as('viewer'))
      .expect(200);
    expect(early.body.variant).toBe('original');

    const job = await runVariantsJob(photoId);
    expect(job.state).toBe('done');

    const listed = (await request(http).get(photosOf(roundId)).set(p.as('viewer')).expect(200))
      .body as Body[];
    expect(listed).toHaveLength(1);
    expect(listed[0]).toMatchObject({
      id: photoId,
      variantState: 'ready',
      width: 2100,
      height: 2800,
      takenAt: '2026-11-30T06:45:12.000Z',
      originalName: 'IMG_0042.JPG',
      uploadedByName: expect.stringContaining('geologist'),
    });

    // The key is made of ids, never the device's file name.
    const row = await app.get(DataSource).getRepository(Photo).findOneByOrFail({ id: photoId });
    expect(row.objectKey).toBe(`projects/${p.projectId}/rounds/${roundId}/photos/${photoId}/original`);

    const signed = await request(http)
      .get(`${photosOf(roundId)}/${photoId}/url?variant=thumbnail`)
      .set(p.as('viewer'))
      .expect(200);
    expect(signed.body.variant).toBe('thumbnail');
    const thumb = Buffer.from(await (await fetch(signed.body.url as string)).arrayBuffer());
    const meta = await sharp(thumb).metadata();
    expect([meta.width, meta.height]).toEqual([240, 320]);
    // Orientation 6 turns the stored top-left corner to the top-right: the red block is there now.
    const { data, info } = await sharp(thumb).raw().toBuffer({ resolveWithObject: true });
    const px = (x: number, y: number) => [
      ...data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3),
    ];
    const [r, g, b] = px(info.width - 10, 10);
    expect(r).toBeGreaterThan(200);
    expect(g + b).toBeLessThan(80);
    const [r2, g2] = px(10, 10);
    expect(r2 > 200 && g2 < 40).toBe(false);

    const original = await request(http)
      .get(`${photosOf(roundId)}/${photoId}/url`)
      .set(p.as('viewer'))
      .expect(200);
    const back = Buffer.from(await (await fetch(original.body.url as string)).arrayBuffer());
    expect(back.equals(jpeg)).toBe(true);
  });

  it('refuses a text file named .jpg with 415 and leaves nothing stored or referenced', async () => {
    const text = Buffer.from('These are field notes, not a photograph.\n'.repeat(20));
    const { photoId, done } = await upload(roundId, text, 'notes.jpg', 'image/jpeg');
    expect(done.status).toBe(415);
    expect(done.body.code).toBe('UNSUPPORTED_MEDIA_TYPE');
    expect(done.body.message).toMatch(/not a JPEG, PNG, WebP or HEIC photo/);
    expect(await app.get(DataSource).getRepository(Photo).findOneBy({ id: photoId })).toBeNull();
    await expect(
      app.get(StorageService).stat(`projects/${p.projectId}/rounds/${roundId}/photos/${photoId}/original`),
    ).rejects.toThrow(/No stored object/);
  });

  it('refuses an oversize file (declared size) with 413 before any byte is sent, and a declared non-image type with 415', async () => {
    const big = await request(http)
      .post(photosOf(roundId))
      .set(p.as('geologist'))
      .send({ fileName: 'huge.jpg', contentType: 'image/jpeg', size: 26 * MiB })
      .expect(413);
    expect(big.body.message).toBe('This file is 26.0 MB; a photo can be at most 25.0 MB.');
    await request(http)
      .post(photosOf(roundId))
      .set(p.as('geologist'))
      .send({ fileName: 'report.pdf', contentType: 'application/pdf', size: 1000 })
      .expect(415);
  });

  it('keeps photos from non-members (404) and writes from readers (403)', async () => {
    const [photo] = (await request(http).get(photosOf(roundId)).set(p.as('viewer')).expect(200))
      .body as Body[];
    await request(http).get(photosOf(roundId)).set(other.as('admin')).expect(404);
    await request(http)
      .get(`${photosOf(roundId)}/${photo.id}/url?variant=thumbnail`)
      .set(other.as('admin'))
      .expect(404);
    await request(http)
      .get(`${photosOf(roundId)}/${photo.id}/url`)
      .set(other.as('geologist'))
      .expect(404);
    await request(http)
      .post(photosOf(roundId))
      .set(p.as('viewer'))
      .send({ fileName: 'a.jpg', contentType: 'image/jpeg', size: 10 })
      .expect(403);
    await request(http)
      .patch(`${photosOf(roundId)}/${photo.id}`)
      .set(p.as('engineer'))
      .send({ caption: 'x' })
      .expect(403);
  });

  it('edits caption, part of the face and pin; removes with a soft delete kept in the audit trail', async () => {
    const [photo] = (await request(http).get(photosOf(roundId)).set(p.as('viewer')).expect(200))
      .body as Body[];
    const edited = await request(http)
      .patch(`${photosOf(roundId)}/${photo.id}`)
      .set(p.as('geologist'))
      .send({ caption: 'Wet shear zone, left shoulder', facePart: 'left-wall', pinX: -2.1, pinY: 1.4 })
      .expect(200);
    expect(edited.body).toMatchObject({
      caption: 'Wet shear zone, left shoulder',
      facePart: 'left-wall',
      pinX: -2.1,
      pinY: 1.4,
    });
    await request(http)
      .patch(`${photosOf(roundId)}/${photo.id}`)
      .set(p.as('geologist'))
      .send({ facePart: 'roof' })
      .expect(400);
    await request(http)
      .patch(`${photosOf(roundId)}/${photo.id}`)
      .set(p.as('geologist'))
      .send({ pinX: null })
      .expect(400);

    await request(http)
      .delete(`${photosOf(roundId)}/${photo.id}`)
      .set(p.as('admin'))
      .expect(204);
    await request(http).get(photosOf(roundId)).set(p.as('viewer')).expect(200).expect([]);
    const kept = await app
      .get(DataSource)
      .getRepository(Photo)
      .findOne({ where: { id: photo.id }, withDeleted: true });
    expect(kept?.deletedAt).toBeInstanceOf(Date);
    const audit = await app
      .get(DataSource)
      .query<Body[]>(`SELECT action FROM audit_events WHERE entity_id = ? ORDER BY created_at`, [photo.id]);
    expect(audit.map((a) => a.action)).toEqual(['photo.added', 'photo.updated', 'photo.removed']);
  });

  it('keeps a scale marked on the photo (two points and a distance), reads it back, refuses bad input with 400 and non-members with 404', async () => {
    const jpeg = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#556677' } })
      .jpeg()
      .toBuffer();
    const { photoId, done } = await upload(roundId, jpeg, 'scale.jpg', 'image/jpeg');
    expect(done.status).toBe(200);
    expect(done.body.scale).toBeNull();
    const at = `${photosOf(roundId)}/${photoId}`;
    const scale = { a: { x: 0.1, y: 0.5 }, b: { x: 0.6, y: 0.5 }, distanceM: 1.2 };
    const saved = await request(http).patch(at).set(p.as('geologist')).send({ scale }).expect(200);
    expect(saved.body.scale).toEqual(scale);
    const read = await request(http).get(at).set(p.as('viewer')).expect(200);
    expect(read.body.scale).toEqual(scale);
    const audit = await app
      .get(DataSource)
      .query<Body[]>(`SELECT action, after FROM audit_events WHERE entity_id = ? ORDER BY created_at`, [
        photoId,
      ]);
    expect(audit.map((a) => a.action)).toEqual(['photo.added', 'photo.updated']);

    const bad = async (body: Body, field: string, message: RegExp) => {
      const res = await request(http).patch(at).set(p.as('geologist')).send(body).expect(400);
      expect(res.body.code).toBe('VALIDATION_FAILED');
      expect(res.body.fields?.[field]).toMatch(message);
    };
    await bad({ scale: { ...scale, b: { x: 0.1, y: 0.5 } } }, 'scale', /two different points/);
    await bad({ scale: { ...scale, distanceM: 0 } }, 'scale.distanceM', /more than 0 m/);
    await bad({ scale: { ...scale, distanceM: -2 } }, 'scale.distanceM', /more than 0 m/);
    await bad({ scale: { ...scale, a: { x: 1.5, y: 0.5 } } }, 'scale.a.x', /from 0 to 1/);
    await bad({ scale: { ...scale, b: { x: 0.5, y: -0.01 } } }, 'scale.b.y', /from 0 to 1/);
    await bad({ scale: { a: scale.a, distanceM: 1 } }, 'scale.b', /second point/);
    // Nothing of the refused attempts was kept.
    expect((await request(http).get(at).set(p.as('viewer')).expect(200)).body.scale).toEqual(scale);

    await request(http).get(at).set(other.as('admin')).expect(404);
    await request(http).patch(at).set(other.as('geologist')).send({ scale }).expect(404);
    await request(http).patch(at).set(p.as('viewer')).send({ scale }).expect(403);

    const cleared = await request(http).patch(at).set(p.as('geologist')).send({ scale: null }).expect(200);
    expect(cleared.body.scale).toBeNull();
  });

  it('refuses writes to a submitted round with 409', async () => {
    const res = await request(http)
      .post(photosOf(submittedId))
      .set(p.as('geologist'))
      .send({ fileName: 'late.jpg', contentType: 'image/jpeg', size: 1000 })
      .expect(409);
    expect(res.body.message).toMatch(/submitted/);
  });

  it('answers 503 with Retry-After when object storage is away (at the start or mid-upload), keeps nothing of the attempt, and a retry succeeds', async () => {
    const down = await createTestApp((c) => ({
      ...c,
      jobs: { ...c.jobs, workerEnabled: false },
      storage: { ...c.storage, endpoint: 'http://127.0.0.1:9' },
    }));
    try {
      const before = await app.get(DataSource).getRepository(Photo).countBy({ roundId });
      const res = await request(down.getHttpServer() as App)
        .post(photosOf(roundId))
        .set(p.as('geologist'))
        .send({ fileName: 'a.jpg', contentType: 'image/jpeg', size: 1000 })
        .expect(503);
      expect(res.headers['retry-after']).toBe('30');
      expect(res.body.message).toMatch(/storage cannot be reached/);
      expect(await app.get(DataSource).getRepository(Photo).countBy({ roundId })).toBe(before);

      // Storage goes away mid-upload: the part is refused with 503, the upload stays open, and the same
      // part sent again once storage answers is taken; completing then stores the photo.
      const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#884422' } })
        .jpeg()
        .toBuffer();
      const started = await request(http)
        .post(photosOf(roundId))
        .set(p.as('geologist'))
        .send({ fileName: 'mid.jpg', contentType: 'image/jpeg', size: jpeg.length })
        .expect(201);
      const id = (started.body as Body).photo.id as string;
      const lost = await request(down.getHttpServer() as App)
        .put(`${photosOf(roundId)}/${id}/parts/1`)
        .set(p.as('geologist'))
        .set('Content-Type', 'application/octet-stream')
        .send(jpeg)
        .expect(503);
      expect(lost.headers['retry-after']).toBe('30');
      const part = await request(http)
        .put(`${photosOf(roundId)}/${id}/parts/1`)
        .set(p.as('geologist'))
        .set('Content-Type', 'application/octet-stream')
        .send(jpeg)
        .expect(200);
      const stored = await request(http)
        .post(`${photosOf(roundId)}/${id}/complete`)
        .set(p.as('geologist'))
        .send({ parts: [part.body] })
        .expect(200);
      expect(stored.body).toMatchObject({ id, uploadState: 'stored', contentType: 'image/jpeg' });
    } finally {
      await down.close();
    }
    // Storage back: the same upload goes through.
    const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#446688' } })
      .png()
      .toBuffer();
    const { done } = await upload(roundId, png, 'again.png', 'image/png');
    expect(done.status).toBe(200);
    expect(done.body.contentType).toBe('image/png');
  });
});
