// Issue 16 item 3: CSV exports of a heading's rounds and joints, read back with papaparse and compared with the
// database row by row; formula-like text is defused for spreadsheets (OWASP "CSV Injection" [from memory]).
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { INestApplication } from '@nestjs/common';
import Papa from 'papaparse';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { Heading } from '../src/modules/headings/heading.entity';
import { Project } from '../src/modules/projects/project.entity';
import { Joint } from '../src/modules/rounds/joint.entity';
import { Round } from '../src/modules/rounds/round.entity';
import { SupportClass } from '../src/modules/support-classes/support-class.entity';
import { makeProject, saveBody, signIn, type Role } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const stamp = String(Date.now() % 1e7);

/** The body of a CSV response as text (supertest buffers unknown types). */
const csvOf = (res: request.Response): string =>
  typeof res.text === 'string' && res.text !== ''
    ? res.text
    : Buffer.from(res.body as Buffer).toString('utf8');
const parse = (text: string) => {
  expect(text.startsWith('\ufeff')).toBe(true);
  const out = Papa.parse<Record<string, string>>(text.slice(1), { header: true, skipEmptyLines: true });
  expect(out.errors).toEqual([]);
  return out;
};
/** The CSV round trip's files (fixtures/joints-round-trip): joints saved, and their export with ids blanked. */
const ROUND_TRIP = join(__dirname, '../../../fixtures/joints-round-trip');
const ID_COLUMNS = ['joint id', 'round id'];
const blankIds = (rows: string[][]) => {
  const at = ID_COLUMNS.map((c) => rows[0].indexOf(c));
  return rows.map((row, i) => (i === 0 ? row : row.map((v, c) => (at.includes(c) ? '' : v))));
};
const binary = (res: request.Response, cb: (e: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('CSV exports (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let ds: DataSource;
  let http: App;
  let tokens: Record<Role, string>;
  const as = (role: Role) => ({ Authorization: `Bearer ${tokens[role]}` });

  beforeAll(async () => {
    app = await createTestApp();
    ds = app.get(DataSource);
    http = app.getHttpServer() as App;
    tokens = await signIn(http, ['viewer']);
  });

  afterAll(async () => {
    await app.close();
  });

  const get = (url: string, headers: Record<string, string>) =>
    request(http).get(url).set(headers).buffer(true).parse(binary);

  it('exports every round of the demo heading HR-U, one row each, as the database holds it', async () => {
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const heading = await ds.getRepository(Heading).findOneByOrFail({ projectId: project.id, code: 'HR-U' });
    const base = `/api/projects/${project.id}/headings/${heading.id}/exports`;
    const res = await get(`${base}/rounds.csv`, as('viewer')).expect(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename="HR-U-rounds.csv"');
    const text = csvOf(res);
    expect(text.split('\r\n').length).toBeGreaterThan(2); // CRLF line ends (RFC 4180)
    const { data, meta } = parse(text);
    expect(meta.fields).toEqual(
      expect.arrayContaining(['face chainage (m)', 'Q', 'RMR89', 'inflow (l/min)']),
    );
    const rounds = await ds.getRepository(Round).find({ where: { headingId: heading.id } });
    expect(data).toHaveLength(rounds.length);
    const codes = new Map(
      (await ds.getRepository(SupportClass).find({ where: { projectId: project.id } })).map((c) => [
        c.id,
        c.code,
      ]),
    );
    for (const row of data) {
      const r = rounds.find((x) => x.id === row['round id'])!;
      expect(r).toBeDefined();
      expect(Number(row['round number'])).toBe(r.roundNumber);
      expect(Number(row['face chainage (m)'])).toBeCloseTo(Number(r.faceChainage), 6);
      expect(row.Q === '' ? null : Number(row.Q)).toEqual(r.q === null ? null : Number(r.q.toPrecision(3)));
      expect(row.RMR89 === '' ? null : Number(row.RMR89)).toEqual(r.rmr);
      expect(row['recommended class']).toBe(r.recommendedClassId ? codes.get(r.recommendedClassId) : '');
      expect(row['trigger level']).toBe(r.triggerLevel ?? 'none');
    }
    // In (stage, round number) order.
    const numbers = data.filter((d) => d.stage === 'full-face').map((d) => Number(d['round number']));
    expect(numbers).toEqual([...numbers].sort((a, b) => a - b));

    const joints = await get(`${base}/joints.csv`, as('viewer')).expect(200);
    const j = parse(csvOf(joints));
    expect(j.data).toHaveLength(await ds.getRepository(Joint).count({ where: { headingId: heading.id } }));
    const first = await ds.getRepository(Joint).findOneByOrFail({ id: j.data[0]['joint id'] });
    expect(Number(j.data[0]['dip direction (°)'])).toBe(first.dipDirection);
    expect(Number(j.data[0]['dip (°)'])).toBe(first.dip);
    expect(j.data[0]['as entered']).toBe(first.orientationText);
  });

  it('defuses text a spreadsheet would run, refuses strangers and unknown headings', async () => {
    const p = await makeProject(app, { code: `EX${stamp}` });
    const created = await request(http)
      .post(`${p.base}/headings/${p.headingId}/rounds`)
      .set(p.as('geologist'))
      .send({ stage: 'full-face', faceChainage: 1003 })
      .expect(201);
    const round = await ds.getRepository(Round).findOneByOrFail({ id: (created.body as Body).id as string });
    await ds.getRepository(Joint).insert({
      id: randomUUID(),
      roundId: round.id,
      headingId: p.headingId,
      faceChainage: 1003,
      seq: 1,
      kind: 'joint',
      orientationText: '130/50',
      notation: 'dip-direction/dip',
      dipDirection: 130,
      dip: 50,
      orientationError: null,
      setLabel: null,
      setOverride: false,
      spacingM: null,
      persistenceM: null,
      apertureMm: null,
      jr: null,
      jrc: null,
      jrcMethod: null,
      infill: '@SUM(A1:A9)',
      ja: null,
      water: null,
      thicknessM: null,
      notes: '=HYPERLINK("http://example.invalid","open")',
      faceOffset: null,
      sameAsJointId: null,
    });
    const base = `${p.base}/headings/${p.headingId}/exports`;
    const res = await get(`${base}/joints.csv`, p.as('viewer')).expect(200);
    const { data } = parse(csvOf(res));
    expect(data).toHaveLength(1);
    expect(data[0].notes).toBe(`'=HYPERLINK("http://example.invalid","open")`);
    expect(data[0].infill).toBe("'@SUM(A1:A9)");
    expect(data[0]['dip (°)']).toBe('50');
    expect(data[0]['joint number']).toBe('1');

    // A member of another project reads nothing (404: the project is not revealed), nor does anyone signed out;
    // a heading of another project is 404 too.
    await get(`${base}/rounds.csv`, as('viewer')).expect(404);
    await get(`${base}/rounds.csv`, {}).expect(401);
    const demo = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const other = await ds.getRepository(Heading).findOneByOrFail({ projectId: demo.id, code: 'HR-U' });
    await get(`${p.base}/headings/${other.id}/exports/rounds.csv`, p.as('viewer')).expect(404);
  });

  it('exports saved joints as the round trip fixture holds them (the web import reads it back: joint-import.test.ts)', async () => {
    const fixture = JSON.parse(readFileSync(join(ROUND_TRIP, 'joints.json'), 'utf8')) as { joints: Body[] };
    const p = await makeProject(app, { code: `RT${stamp}` });
    const created = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: 1003 })
        .expect(201)
    ).body as Body;
    await request(http)
      .put(`${p.base}/rounds/${created.id as string}`)
      .set(p.as('geologist'))
      .send(saveBody(created, { joints: fixture.joints }))
      .expect(200);
    const res = await get(`${p.base}/headings/${p.headingId}/exports/joints.csv`, p.as('viewer')).expect(200);
    const text = csvOf(res);
    const exported = Papa.parse<string[]>(text.slice(1), { skipEmptyLines: true });
    expect(exported.errors).toEqual([]);
    const expected = Papa.parse<string[]>(
      readFileSync(join(ROUND_TRIP, 'joints-export.csv'), 'utf8').replace(/^\ufeff/, ''),
      { skipEmptyLines: true },
    );
    expect(blankIds(exported.data)).toEqual(blankIds(expected.data));
    // The ids are real: one round, five joints of it.
    const roundIds = new Set(exported.data.slice(1).map((r) => r[exported.data[0].indexOf('round id')]));
    expect([...roundIds]).toEqual([created.id]);
    expect(exported.data).toHaveLength(1 + fixture.joints.length);
  });
});
