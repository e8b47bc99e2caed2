import type { INestApplication } from '@nestjs/common';
import {
  faceFrameOf,
  SKETCH_PIN_DISC_RADIUS_PX,
  SKETCH_PIN_DISC_RISE_PX,
  sketchSvgView,
  svgPx,
  type SketchDocument,
} from '@roundbook/domain';
import sharp from 'sharp';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { Job } from '../src/infrastructure/jobs/job.entity';
import { JobsWorker } from '../src/infrastructure/jobs/jobs.worker';
import { StorageService } from '../src/infrastructure/storage/storage.service';
import { Photo } from '../src/modules/photos/photo.entity';
import { SKETCH_RENDER_PX_PER_M, sketchRenderKey } from '../src/modules/rounds/sketch-render.service';
import { latestAudit, makeProject, saveBody, testJoint, type TestProject } from './factories';
import { createTestApp } from './test-app';

// Issue 13, item 2: the face sketch is saved with the round under its optimistic lock, checked by the
// domain's restoreSketch (bad document → 400 with the reason, too big → 413), and frozen at submit.
type Body = Record<string, any>;
const code = `SK${Date.now() % 1e5}`;

const trace = (id: string, jointId: string | null = null) => ({
  id,
  kind: 'trace',
  mode: 'polyline',
  points: [
    [-2.5, 1.2],
    [0.4, 3.1],
    [2.2, 4.8],
  ],
  link: jointId === null ? null : { jointId },
});
const sketchOf = (...elements: Body[]) => ({ schemaVersion: 2, frame: 'face-m', elements });

describe('round sketch: saved with the round, validated, frozen (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let round: Body;

  beforeAll(async () => {
    // jobs run only when a test ticks the worker (the sketch render)
    app = await createTestApp((c) => ({ ...c, jobs: { ...c.jobs, workerEnabled: false } }));
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code });
  });
  afterAll(async () => app.close());

  let face = 1003;
  beforeEach(async () => {
    face += 3;
    const created = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: face })
        .expect(201)
    ).body as Body;
    round = (
      await request(http)
        .put(`${p.base}/rounds/${created.id}`)
        .set(p.as('geologist'))
        .send(saveBody(created, { joints: [testJoint('120/60')] }))
        .expect(200)
    ).body as Body;
  });

  const save = (body: Body) =>
    request(http).put(`${p.base}/rounds/${round.id}`).set(p.as('geologist')).send(body);

  it('a new round has no sketch; a saved one comes back as saved, linked to the joint by its id', async () => {
    expect(round.sketch).toBeNull();
    const jointId = round.joints[0].id as string;
    const doc = sketchOf(trace('t1', jointId), {
      id: 'w1',
      kind: 'water',
      at: [1, 2],
      state: 'flowing',
      inflowLpm: 12,
    });
    const saved = (await save({ version: round.version, sketch: doc }).expect(200)).body as Body;
    expect(saved.sketch).toEqual(doc);
    expect(saved.version).toBe(round.version + 1);
    // a save that leaves the sketch out keeps it
    const other = (await save({ version: saved.version, distantParts: 'crown' }).expect(200)).body as Body;
    expect(other.sketch).toEqual(doc);
    const read = (await request(http).get(`${p.base}/rounds/${round.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(read.sketch.elements[0].link).toEqual({ jointId });
    // the audit keeps a summary of the change, not the drawing
    const audit = await latestAudit(app, round.id);
    expect(audit.after).toMatchObject({ sketch: '2 element(s)' });
  });

  it('upgrades a version 1 document on the way in', async () => {
    const v1 = {
      schemaVersion: 1,
      traces: [
        {
          id: 'old',
          points: [
            [0, 1],
            [1, 2],
          ],
          jointId: null,
        },
      ],
    };
    const saved = (await save({ version: round.version, sketch: v1 }).expect(200)).body as Body;
    expect(saved.sketch).toEqual(
      sketchOf({
        id: 'old',
        kind: 'trace',
        mode: 'freehand',
        points: [
          [0, 1],
          [1, 2],
        ],
        link: null,
      }),
    );
  });

  it('refuses a bad document with 400 and the reason, and keeps what was there', async () => {
    const good = (await save({ version: round.version, sketch: sketchOf(trace('t1')) }).expect(200))
      .body as Body;
    const cases: Array<[unknown, RegExp]> = [
      [{ schemaVersion: 7, frame: 'face-m', elements: [] }, /version 7 is not known/],
      [
        sketchOf({
          ...trace('t2'),
          points: [
            [0, 0],
            [0, 900],
          ],
        }),
        /outside the sketch/,
      ],
      [sketchOf(trace('t2'), trace('t2')), /used twice/],
      [sketchOf({ id: 'x', kind: 'scribble' }), /one of trace, label, water, overbreak/],
      ['a sketch', /document object/],
    ];
    for (const [sketch, reason] of cases) {
      const res = await save({ version: good.version, sketch }).expect(400);
      expect(res.body.message).toMatch(reason);
    }
    const read = (await request(http).get(`${p.base}/rounds/${round.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(read.sketch).toEqual(good.sketch);
    expect(read.version).toBe(good.version);
  });

  it('refuses a sketch over 512 KB with 413', async () => {
    // 1,900 traces of 20 points each: about 740 KB of JSON, within the 1 MB round body
    const mm = (v: number) => Math.round(v * 1000) / 1000;
    const elements = Array.from({ length: 1900 }, (_, i) => ({
      ...trace(`t${i}`),
      points: Array.from({ length: 20 }, (_v, k) => [mm(-2.123 + k * 0.1), mm(1.654 + (i % 40) * 0.1)]),
    }));
    expect(JSON.stringify(sketchOf(...elements)).length).toBeGreaterThan(512 * 1024);
    expect(JSON.stringify(sketchOf(...elements)).length).toBeLessThan(1000 * 1024);
    const res = await save({ version: round.version, sketch: sketchOf(...elements) }).expect(413);
    expect(res.body.message).toMatch(/at most 512 KB/);
  });

  it('a stale version is refused with 409 and the sketch is not overwritten', async () => {
    const first = (await save({ version: round.version, sketch: sketchOf(trace('mine')) }).expect(200))
      .body as Body;
    const res = await save({ version: round.version, sketch: sketchOf(trace('theirs')) }).expect(409);
    expect(res.body.code).toBe('STALE_VERSION');
    expect(res.body.details.current.sketch.elements[0].id).toBe('mine');
    expect(first.sketch.elements[0].id).toBe('mine');
  });

  it('a viewer cannot save a sketch; the sketch is frozen in the revision at submit', async () => {
    await request(http)
      .put(`${p.base}/rounds/${round.id}`)
      .set(p.as('viewer'))
      .send({ version: round.version, sketch: sketchOf(trace('v')) })
      .expect(403);
    const c1 = p.classes.find((c) => c.code === 'C1')!;
    const ready = (
      await save({
        version: round.version,
        sketch: sketchOf(trace('frozen')),
        recommendedClassId: c1.id,
        nextRoundLength: 3,
      }).expect(200)
    ).body as Body;
    const submitted = (
      await request(http)
        .post(`${p.base}/rounds/${round.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: ready.version })
        .expect(200)
    ).body as Body;
    expect(submitted.status).toBe('submitted');
    // no more edits once submitted
    await save({ version: submitted.version, sketch: sketchOf() }).expect(409);
    const revisions = (
      await request(http).get(`${p.base}/rounds/${round.id}/revisions`).set(p.as('viewer')).expect(200)
    ).body as Body[];
    expect(revisions).toHaveLength(1);
    expect(revisions[0].record.sketch).toEqual(sketchOf(trace('frozen')));
  });

  /** Runs due jobs in this process until the revision's render job has finished (each tick waits for its jobs). */
  async function runRenderJob(revisionId: string): Promise<Job> {
    const worker = app.get(JobsWorker);
    const jobs = app.get(DataSource).getRepository(Job);
    for (let i = 0; i < 20; i++) {
      await worker.tick();
      await worker.idle();
      const job = await jobs.findOne({ where: { dedupeKey: `sketch.render:${revisionId}` } });
      if (job && (job.state === 'done' || job.state === 'dead')) return job;
    }
    throw new Error('the sketch render job did not finish');
  }

  const submitWith = async (sketch: Body | null) => {
    const c1 = p.classes.find((c) => c.code === 'C1')!;
    const ready = (
      await save({ version: round.version, sketch, recommendedClassId: c1.id, nextRoundLength: 3 }).expect(
        200,
      )
    ).body as Body;
    await request(http)
      .post(`${p.base}/rounds/${round.id}/submit`)
      .set(p.as('geologist'))
      .send({ version: ready.version })
      .expect(200);
    const revisions = (
      await request(http).get(`${p.base}/rounds/${round.id}/revisions`).set(p.as('viewer')).expect(200)
    ).body as Body[];
    return revisions[revisions.length - 1];
  };
  const renderOf = () => request(http).get(`${p.base}/rounds/${round.id}/sketch/render`).set(p.as('viewer'));

  it('at submit a job renders the frozen sketch to PNG and SVG in object storage; the trace is where it was drawn', async () => {
    const doc = sketchOf(trace('drawn'));
    const revision = await submitWith(doc);
    // before the job has run: the picture is on its way
    expect((await renderOf().expect(200)).body).toMatchObject({ state: 'rendering', pngUrl: null });
    expect((await runRenderJob(revision.id as string)).state).toBe('done');

    const key = sketchRenderKey(p.projectId, round.id as string, revision.revision as number, 'png');
    expect(await app.get(StorageService).stat(key)).toMatchObject({ contentType: 'image/png' });
    const render = (await renderOf().expect(200)).body as Body;
    expect(render).toMatchObject({ state: 'ready', revision: revision.revision });
    const png = Buffer.from(await (await fetch(render.pngUrl as string)).arrayBuffer());
    const svg = await (await fetch(render.svgUrl as string)).text();
    expect(svg).toContain('<polyline data-id="drawn"');

    // where the picture puts the face frame: the heading's profile (6 m circle) at 60 px/m
    const heading = (
      await request(http).get(`${p.base}/headings/${p.headingId}`).set(p.as('viewer')).expect(200)
    ).body as Body;
    const frame = faceFrameOf(heading as never, 'full-face')!;
    const view = sketchSvgView(doc as SketchDocument, frame, { pxPerMetre: SKETCH_RENDER_PX_PER_M });
    const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    expect([info.width, info.height]).toEqual([view.width, view.height]);
    const rgbAt = (m: [number, number]) => {
      const [x, y] = svgPx(view, m).map(Math.round);
      const i = (y * info.width + x) * 3;
      return [data[i], data[i + 1], data[i + 2]];
    };
    // the middle of the trace's first leg, (−2.5, 1.2)–(0.4, 3.1): (−1.05, 2.15) m — the ink #1f2328
    const ink = [0x1f, 0x23, 0x28];
    rgbAt([-1.05, 2.15]).forEach((v, k) => expect(Math.abs(v - ink[k])).toBeLessThanOrEqual(24));
    // 0.4 m below that point, off the trace and off the grid: paper (light)
    rgbAt([-1.05, 1.75]).forEach((v) => expect(v).toBeGreaterThan(200));
  });

  it('the picture draws the photos pinned on the face, numbered as in the gallery', async () => {
    // Three photos of the round (issue 14 keeps each pin on its photo): the first without a pin, the second
    // pinned at (1.5, 2) m, the third still uploading (not in the gallery, so not drawn).
    const photos = app.get(DataSource).getRepository(Photo);
    const photo = (n: number, extra: Partial<Photo>) => ({
      id: globalThis.crypto.randomUUID(),
      projectId: p.projectId,
      roundId: round.id as string,
      objectKey: `projects/${p.projectId}/rounds/${round.id as string}/photos/test-${n}.jpg`,
      uploadState: 'stored' as const,
      contentType: 'image/jpeg',
      size: 1000,
      partSize: 1000,
      originalName: `face-${n}.jpg`,
      uploadedBy: globalThis.crypto.randomUUID(),
      createdAt: new Date(Date.UTC(2026, 0, 1, 8, n)),
      ...extra,
    });
    await photos.insert([
      photo(1, {}),
      photo(2, { pinX: 1.5, pinY: 2 }),
      photo(3, { pinX: -1.5, pinY: 2, uploadState: 'uploading' }),
    ]);
    const doc = sketchOf(trace('with-pins'));
    const revision = await submitWith(doc);
    expect((await runRenderJob(revision.id as string)).state).toBe('done');
    const render = (await renderOf().expect(200)).body as Body;
    const svg = await (await fetch(render.svgUrl as string)).text();
    expect(svg.match(/<g data-pin="/g)).toHaveLength(1);
    expect(svg).toMatch(/<g data-pin="2">[\s\S]*?>2<\/text>/);

    const heading = (
      await request(http).get(`${p.base}/headings/${p.headingId}`).set(p.as('viewer')).expect(200)
    ).body as Body;
    const view = sketchSvgView(doc as SketchDocument, faceFrameOf(heading as never, 'full-face')!, {
      pxPerMetre: SKETCH_RENDER_PX_PER_M,
      pins: [{ number: 2, at: [1.5, 2] }],
    });
    const png = Buffer.from(await (await fetch(render.pngUrl as string)).arrayBuffer());
    const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    expect([info.width, info.height]).toEqual([view.width, view.height]);
    const rgb = (x: number, y: number) => {
      const i = (Math.round(y) * info.width + Math.round(x)) * 3;
      return [data[i], data[i + 1], data[i + 2]];
    };
    const ink = [0x1f, 0x23, 0x28];
    const isInk = (c: number[]) => c.every((v, k) => Math.abs(v - ink[k]) <= 24);
    const [x, y] = svgPx(view, [1.5, 2]);
    const discY = y - SKETCH_PIN_DISC_RISE_PX;
    // the foot of the stem on the spot, and the disc's left part (beside its number): the ink
    expect(isInk(rgb(x, y))).toBe(true);
    expect(isInk(rgb(x - 8, discY))).toBe(true);
    // the number: light pixels inside the disc, within its middle 8 px
    let light = 0;
    for (let dy = -6; dy <= 6; dy++)
      for (let dx = -4; dx <= 4; dx++) if (rgb(x + dx, discY + dy).every((v) => v > 200)) light++;
    expect(light).toBeGreaterThan(4);
    // beyond the disc, off the trace: paper
    expect(rgb(x, discY - SKETCH_PIN_DISC_RADIUS_PX - 8).every((v) => v > 200)).toBe(true);
    // the uploading photo's spot has no pin: paper where its disc would be
    const [ux, uy] = svgPx(view, [-1.5, 2]);
    expect(isInk(rgb(ux - 8, uy - SKETCH_PIN_DISC_RISE_PX))).toBe(false);
  });

  it('no sketch, no render job and a 404 with the reason', async () => {
    const revision = await submitWith(null);
    const res = await renderOf().expect(404);
    expect(res.body.message).toMatch(/submitted sketch/);
    const jobs = app.get(DataSource).getRepository(Job);
    expect(await jobs.countBy({ dedupeKey: `sketch.render:${revision.id as string}` })).toBe(0);
  });
});
