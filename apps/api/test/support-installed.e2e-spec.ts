// Issue 15, item 2: support as built on a confirmed round — the checklist prefilled from the confirmed class,
// recorded with the version, refused before confirmation and for geologists, shown on the Board while
// outstanding, audited, and handed to the handover as outstanding items. On a project of this file's own.
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { SupportRecordsService } from '../src/modules/support-records/support-records.service';
import { latestAudit, makeProject, saveBody, TEST_PASSWORD, testQInput, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `SI${String(Date.now() % 1e6)}`;

describe('Support as built (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let confirmed: Body;
  let draft: Body;
  const classId = (c: string) => p.classes.find((x) => x.code === c)!.id as string;
  const url = (roundId: string) => `${p.base}/rounds/${roundId}/support-record`;
  const board = async (): Promise<Body> =>
    ((await request(http).get(p.base).set(p.as('supervisor')).expect(200)).body.headings as Body[]).find(
      (h) => h.id === p.headingId,
    )!;

  /** Opens a round, saves it with Q = 60/4 × 1.5/4 × 1/1 = 5.625 (Barton et al. 1974) [computed here], inside
   * C2 (1 ≤ Q < 10), with C2 recommended, and submits it. */
  const mapRound = async (faceChainage: number): Promise<Body> => {
    const opened = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage })
        .expect(201)
    ).body as Body;
    const saved = (
      await request(http)
        .put(`${p.base}/rounds/${opened.id}`)
        .set(p.as('geologist'))
        .send(
          saveBody(opened, {
            qInput: { ...testQInput, ja: 4 },
            recommendedClassId: classId('C2'),
            nextRoundLength: 3,
          }),
        )
        .expect(200)
    ).body as Body;
    return (
      await request(http)
        .post(`${p.base}/rounds/${saved.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: saved.version })
        .expect(200)
    ).body as Body;
  };

  /** Every element as the GET listed it, with `changes` by element on top. */
  const itemsFrom = (record: Body, changes: Record<string, Body>) =>
    (record.items as Body[]).map((i) => ({
      element: i.element,
      status: i.status,
      quantity: i.quantity,
      length: i.length,
      reason: i.reason,
      ...changes[i.element as string],
    }));

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, {
      code,
      classes: [
        { code: 'C1', name: 'Spot bolts', maxRoundLength: 4, qMin: 10 },
        {
          code: 'C2',
          name: 'Pattern bolts and sprayed concrete',
          maxRoundLength: 3,
          qMin: 1,
          qMax: 10,
          boltType: 'Invented grouted bar',
          boltLength: 3,
          boltPattern: '1.5 m × 1.5 m',
          shotcreteMm: 50,
          probingRequired: true,
        },
      ],
    });
    const submitted = await mapRound(1003);
    await request(http)
      .post(`${p.base}/rounds/${submitted.id}/confirm`)
      .set(p.as('engineer'))
      .send({
        version: submitted.version,
        classId: classId('C2'),
        roundLength: 3,
        comments: '',
        reason: '',
        password: TEST_PASSWORD,
      })
      .expect(200);
    confirmed = submitted;
    draft = await mapRound(1006);
  });

  afterAll(async () => {
    await app.close();
  });

  it('prefills the checklist from the confirmed class: its elements outstanding, the others not needed', async () => {
    const record = (await request(http).get(url(confirmed.id)).set(p.as('viewer')).expect(200)).body as Body;
    expect(record).toMatchObject({ confirmed: true, recorded: false, version: 0, classCode: 'C2' });
    const by = Object.fromEntries((record.items as Body[]).map((i) => [i.element, i]));
    expect(Object.keys(by).sort()).toEqual(
      ['bolts', 'mesh', 'probe-holes', 'spiles', 'sprayed-concrete', 'steel-sets'].sort(),
    );
    expect(by.bolts).toMatchObject({
      status: 'outstanding',
      unit: 'count',
      hasLength: true,
      planned: { inClass: true, length: 3, text: 'Invented grouted bar, 1.5 m × 1.5 m' },
    });
    expect(by['sprayed-concrete']).toMatchObject({
      status: 'outstanding',
      unit: 'mm',
      planned: { quantity: 50 },
    });
    expect(by['probe-holes'].status).toBe('outstanding');
    expect(by.mesh).toMatchObject({ status: 'not-needed', reason: 'Not an element of class C2.' });
    expect(record.outstandingCount).toBe(3);
  });

  it('flags the heading on the Board while nothing is recorded, and lists it for the handover', async () => {
    expect((await board()).supportOutstanding).toBe(true);
    const outstanding = await app.get(SupportRecordsService).outstandingForHeading(p.headingId);
    expect(outstanding).toHaveLength(1);
    expect(outstanding[0]).toMatchObject({ roundId: confirmed.id, classCode: 'C2', recorded: false });
    expect(outstanding[0].items.map((i) => i.element)).toEqual(['probe-holes', 'sprayed-concrete', 'bolts']);
    // The handover's draft carries the same items, one line each, in words (issue 15 item 2).
    const handoverDraft = (
      await request(http)
        .get(`${p.base}/handovers/draft?headingIds=${p.headingId}`)
        .set(p.as('supervisor'))
        .expect(200)
    ).body as Body;
    const lines = handoverDraft.headings[0].supportOutstanding as string[];
    expect(lines).toHaveLength(3);
    const round = `Round ${confirmed.roundNumber as number} (`;
    expect(lines.every((l) => l.startsWith(round) && l.includes('class C2'))).toBe(true);
    expect(lines.find((l) => l.includes('Rock bolts'))).toMatch(
      /planned Invented grouted bar, 1\.5 m × 1\.5 m.*nothing recorded/,
    );
    expect(lines.find((l) => l.includes('Sprayed concrete'))).toMatch(/50 mm/);
  });

  it('refuses a round that is not confirmed (409, in words), and a geologist (403)', async () => {
    const body = {
      version: 0,
      items: [{ element: 'bolts', status: 'done', quantity: 1, length: 3, reason: '' }],
    };
    const res = await request(http).put(url(draft.id)).set(p.as('supervisor')).send(body).expect(409);
    expect(res.body.message).toMatch(/once the round is confirmed; round \d+ is submitted/);
    const geo = await request(http).put(url(confirmed.id)).set(p.as('geologist')).send(body);
    expect(geo.status).toBe(403);
    const notYet = (await request(http).get(url(draft.id)).set(p.as('geologist')).expect(200)).body as Body;
    expect(notYet).toMatchObject({ confirmed: false, items: [] });
  });

  it('refuses bad quantities with 400 and clear words, and saves nothing', async () => {
    const record = (await request(http).get(url(confirmed.id)).set(p.as('supervisor')).expect(200))
      .body as Body;
    const bad = await request(http)
      .put(url(confirmed.id))
      .set(p.as('supervisor'))
      .send({
        version: 0,
        items: itemsFrom(record, {
          bolts: { status: 'done', quantity: 2.5, length: 3 },
          mesh: { status: 'not-needed', reason: '' },
        }),
      })
      .expect(400);
    const index = (e: string) => (record.items as Body[]).findIndex((i) => i.element === e);
    expect(bad.body.fields[`items.${index('bolts')}.quantity`]).toBe(
      'Rock bolts: count whole pieces (no fractions).',
    );
    expect(bad.body.fields[`items.${index('mesh')}.reason`]).toMatch(/why it is not needed/);
    const missing = await request(http)
      .put(url(confirmed.id))
      .set(p.as('supervisor'))
      .send({
        version: 0,
        items: [{ element: 'bolts', status: 'outstanding', quantity: null, length: null, reason: '' }],
      })
      .expect(400);
    expect(missing.body.message).toMatch(/lists every element; missing: Probe holes, Sprayed concrete/);
    const again = (await request(http).get(url(confirmed.id)).set(p.as('supervisor')).expect(200))
      .body as Body;
    expect(again.recorded).toBe(false);
  });

  let first: Body;

  it('records the installed support (supervisor), by whom and when, audited; a stale version gets 409', async () => {
    const record = (await request(http).get(url(confirmed.id)).set(p.as('supervisor')).expect(200))
      .body as Body;
    const res = await request(http)
      .put(url(confirmed.id))
      .set(p.as('supervisor'))
      .send({
        version: 0,
        items: itemsFrom(record, {
          bolts: { status: 'done', quantity: 14, length: 3, installedAt: '2026-12-03T06:30:00.000Z' },
          'probe-holes': { status: 'done', quantity: 2, length: 24 },
          'sprayed-concrete': {
            status: 'outstanding',
            quantity: 25,
            reason: 'Sprayer down; second layer next shift.',
          },
        }),
      })
      .expect(200);
    first = res.body as Body;
    expect(first).toMatchObject({ recorded: true, version: 1, outstandingCount: 1 });
    const bolts = (first.items as Body[]).find((i) => i.element === 'bolts')!;
    expect(bolts).toMatchObject({
      quantity: 14,
      length: 3,
      installedByName: `Test supervisor ${code}`,
      installedAt: '2026-12-03T06:30:00.000Z',
    });
    const mesh = (first.items as Body[]).find((i) => i.element === 'mesh')!;
    expect(mesh.installedBy).toBeNull(); // left as the class's plan had it

    const audit = await latestAudit(app, await recordId());
    expect(audit).toMatchObject({ entityType: 'support-record', action: 'create' });
    expect(audit.after).toMatchObject({
      roundId: confirmed.id,
      classCode: 'C2',
      outstandingCount: 1,
      items: { bolts: { status: 'done', quantity: 14, length: 3 } },
    });

    // Someone else saves on version 1 first: the stale save is refused with the current record.
    const engineer = await request(http)
      .put(url(confirmed.id))
      .set(p.as('engineer'))
      .send({ version: 1, items: itemsFrom(first, { spiles: { status: 'done', quantity: 6, length: 4 } }) })
      .expect(200);
    expect(engineer.body.version).toBe(2);
    const stale = await request(http)
      .put(url(confirmed.id))
      .set(p.as('supervisor'))
      .send({ version: 1, items: itemsFrom(first, {}) })
      .expect(409);
    expect(stale.body.code).toBe('STALE_VERSION');
    expect(stale.body.message).toMatch(/Someone else recorded support/);
    const firstSave = await request(http)
      .put(url(confirmed.id))
      .set(p.as('supervisor'))
      .send({ version: 0, items: itemsFrom(first, {}) })
      .expect(409);
    expect(firstSave.body.code).toBe('STALE_VERSION');
  });

  async function recordId(): Promise<string> {
    const rows = await app
      .get(DataSource)
      .query<Array<{ id: string }>>('SELECT id FROM support_records WHERE round_id = ?', [confirmed.id]);
    return rows[0].id;
  }

  it('keeps the Board flag while an item is outstanding and clears it once all is done or not needed', async () => {
    expect((await board()).supportOutstanding).toBe(true);
    const outstanding = await app.get(SupportRecordsService).outstandingForHeading(p.headingId);
    expect(outstanding[0]).toMatchObject({ recorded: true });
    expect(outstanding[0].items.map((i) => [i.element, i.quantity, i.reason])).toEqual([
      ['sprayed-concrete', 25, 'Sprayer down; second layer next shift.'],
    ]);
    const current = (await request(http).get(url(confirmed.id)).set(p.as('supervisor')).expect(200))
      .body as Body;
    const done = await request(http)
      .put(url(confirmed.id))
      .set(p.as('supervisor'))
      .send({
        version: current.version,
        items: itemsFrom(current, { 'sprayed-concrete': { status: 'done', quantity: 50, reason: '' } }),
      })
      .expect(200);
    expect(done.body.outstandingCount).toBe(0);
    expect((await board()).supportOutstanding).toBe(false);
    expect(await app.get(SupportRecordsService).outstandingForHeading(p.headingId)).toEqual([]);
    const audit = await latestAudit(app, await recordId());
    expect(audit).toMatchObject({
      action: 'update',
      before: { items: { 'sprayed-concrete': { status: 'outstanding' } } },
    });
    expect(Object.keys(audit.after!.items as Body)).toEqual(['sprayed-concrete']);
  });

  it('has a migration that matches the entity (no schema change pending for support_records)', async () => {
    const pending = await app.get(DataSource).driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query).filter((q) => q.includes('support_records'))).toEqual([]);
  });
});
