import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { Project } from '../src/modules/projects/project.entity';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { createTestApp, DEMO_PASSWORD } from './test-app';

type Body = Record<string, any>;
/** A suffix that keeps this run's codes apart from earlier runs against the same database. */
const run = String(Date.now() % 100000);

describe('Setup: headings, support classes, trigger rules, team (e2e, real MariaDB and SMTP fake)', () => {
  let app: INestApplication;
  let http: App;
  let projectId: string;
  let base: string;
  const tokens: Record<string, string> = {};
  const as = (role: string) => ({ Authorization: `Bearer ${tokens[role]}` });

  const lastAudit = async (entityId: string): Promise<AuditEvent> => {
    const events = await app
      .get(DataSource)
      .getRepository(AuditEvent)
      .find({ where: { entityId }, order: { createdAt: 'DESC' }, take: 1 });
    return events[0];
  };

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    for (const role of ['admin', 'geologist', 'engineer', 'supervisor', 'viewer']) {
      tokens[role] = (
        (
          await request(http)
            .post('/api/auth/login')
            .send({ email: `${role}@roundbook.test`, password: DEMO_PASSWORD })
            .expect(200)
        ).body as Body
      ).accessToken as string;
    }
    projectId = (await app.get(DataSource).getRepository(Project).findOneByOrFail({ code: 'BRH' })).id;
    base = `/api/projects/${projectId}`;
  });

  afterAll(async () => {
    await app.close();
  });

  describe('headings', () => {
    const horseshoe = {
      code: `AD-${run}`,
      name: `Adit 2 access ${run}`,
      startChainage: 0,
      driveTrend: 45,
      gradientPercent: -8,
      profileShape: 'horseshoe',
      profileWidth: 6,
      profileHeight: 6.2,
      axisHeight: 3.1,
      stages: ['top-heading', 'bench'],
      plannedRoundLength: 3,
    };

    it('lets every member read the headings, with the seeded alignment and profile', async () => {
      const res = await request(http).get(`${base}/headings`).set(as('viewer')).expect(200);
      expect((res.body as Body[]).map((h) => h.code)).toEqual(expect.arrayContaining(['HR-D', 'HR-U']));
      expect((res.body as Body[]).find((h) => h.code === 'HR-U')).toMatchObject({
        driveTrend: 312.5,
        profileShape: 'horseshoe',
        chainageStyle: 'km+m',
        startEasting: 4120,
      });
    });

    it('refuses non-admins with 403', async () => {
      for (const role of ['geologist', 'engineer', 'supervisor', 'viewer']) {
        await request(http).post(`${base}/headings`).set(as(role)).send(horseshoe).expect(403);
      }
    });

    it('puts each server-side validation message on its field', async () => {
      const res = await request(http)
        .post(`${base}/headings`)
        .set(as('admin'))
        .send({ ...horseshoe, driveTrend: 360, stages: [], plannedRoundLength: 12 })
        .expect(400);
      expect(Object.keys(res.body.fields as object).sort()).toEqual([
        'driveTrend',
        'plannedRoundLength',
        'stages',
      ]);
      const axis = await request(http)
        .post(`${base}/headings`)
        .set(as('admin'))
        .send({ ...horseshoe, axisHeight: 7 })
        .expect(400);
      expect(axis.body.fields).toEqual({ axisHeight: expect.stringMatching(/within the height/) });
      const circle = await request(http)
        .post(`${base}/headings`)
        .set(as('admin'))
        .send({ ...horseshoe, profileShape: 'circular' })
        .expect(400);
      expect(circle.body.fields).toEqual({ profileHeight: expect.stringMatching(/equal width and height/) });
    });

    it('creates a heading, audits it, refuses a duplicate code, and updates with optimistic locking', async () => {
      const created = await request(http)
        .post(`${base}/headings`)
        .set(as('admin'))
        .send(horseshoe)
        .expect(201);
      const h = created.body as Body;
      expect(h).toMatchObject({ code: `AD-${run}`, version: 1, chainageDecimals: 1 });
      expect(await lastAudit(h.id as string)).toMatchObject({
        action: 'create',
        after: expect.objectContaining({ code: `AD-${run}`, driveTrend: 45 }),
      });
      const dup = await request(http).post(`${base}/headings`).set(as('admin')).send(horseshoe).expect(409);
      expect(dup.body.fields).toEqual({ code: expect.any(String) });

      const updated = await request(http)
        .patch(`${base}/headings/${h.id}`)
        .set(as('admin'))
        .send({ driveTrend: 47.5, version: 1 })
        .expect(200);
      expect(updated.body).toMatchObject({ driveTrend: 47.5, version: 2 });
      expect(await lastAudit(h.id as string)).toMatchObject({
        action: 'update',
        before: { driveTrend: 45 },
        after: { driveTrend: 47.5 },
      });
      const stale = await request(http)
        .patch(`${base}/headings/${h.id}`)
        .set(as('admin'))
        .send({ name: 'Old screen', version: 1 })
        .expect(409);
      expect(stale.body).toMatchObject({
        code: 'STALE_VERSION',
        details: { current: { driveTrend: 47.5, version: 2 } },
      });
    });
  });

  describe('heading geometry after rounds exist', () => {
    it('asks for confirmation before changing the drive of a heading with rounds, then applies it', async () => {
      const hu = (
        (await request(http).get(`${base}/headings`).set(as('admin')).expect(200)).body as Body[]
      ).find((h) => h.code === 'HR-U')!;
      const ask = await request(http)
        .patch(`${base}/headings/${hu.id}`)
        .set(as('admin'))
        .send({ driveTrend: 315, version: hu.version })
        .expect(409);
      expect(ask.body).toMatchObject({ code: 'NEEDS_CONFIRMATION', details: { fields: ['driveTrend'] } });
      expect(ask.body.details.rounds).toBeGreaterThan(0);
      expect(ask.body.message).toMatch(/drive direction/);
      const done = await request(http)
        .patch(`${base}/headings/${hu.id}`)
        .set(as('admin'))
        .send({ driveTrend: 315, version: hu.version, confirmRecompute: true })
        .expect(200);
      expect(done.body.driveTrend).toBe(315);
      // A name change needs no confirmation; then the drive goes back.
      const renamed = await request(http)
        .patch(`${base}/headings/${hu.id}`)
        .set(as('admin'))
        .send({ name: hu.name, version: done.body.version })
        .expect(200);
      await request(http)
        .patch(`${base}/headings/${hu.id}`)
        .set(as('admin'))
        .send({ driveTrend: hu.driveTrend, version: renamed.body.version, confirmRecompute: true })
        .expect(200);
    });
  });

  describe('support classes', () => {
    it('shows the seeded library best ground first, with no range warnings', async () => {
      const res = await request(http).get(`${base}/support-classes`).set(as('supervisor')).expect(200);
      expect((res.body.classes as Body[]).map((c) => c.code)).toEqual([
        'SC-A',
        'SC-B',
        'SC-C',
        'SC-D',
        'SC-E',
      ]);
      expect(res.body.warnings).toEqual([]);
    });

    it('warns when a new class overlaps, lets the admin retire, reorder and delete, and audits each step', async () => {
      await request(http)
        .post(`${base}/support-classes`)
        .set(as('engineer'))
        .send({ code: 'X', name: 'x', maxRoundLength: 2, qMin: 1 })
        .expect(403);
      const bad = await request(http)
        .post(`${base}/support-classes`)
        .set(as('admin'))
        .send({ code: 'SC-X', name: 'No range', maxRoundLength: 2 })
        .expect(400);
      expect(bad.body.fields).toEqual({ qMin: expect.stringMatching(/Q range, an RMR89 range/) });
      const inverted = await request(http)
        .post(`${base}/support-classes`)
        .set(as('admin'))
        .send({ code: 'SC-X', name: 'x', maxRoundLength: 2, qMin: 5, qMax: 2 })
        .expect(400);
      expect(Object.keys(inverted.body.fields as object)).toEqual(['qMax']);

      const added = await request(http)
        .post(`${base}/support-classes`)
        .set(as('admin'))
        .send({
          code: 'SC-B2',
          name: 'Systematic bolting, wet ground',
          maxRoundLength: 3,
          qMin: 2,
          qMax: 8,
          rmrMin: 50,
          rmrMax: 60,
          shotcreteMm: 75,
          probingRequired: true,
        })
        .expect(201);
      const library = added.body as Body;
      const b2 = (library.classes as Body[]).find((c) => c.code === 'SC-B2')!;
      expect(b2.sortOrder).toBe(
        Math.max(
          ...(library.classes as Body[]).filter((c) => c.code !== 'SC-B2').map((c) => c.sortOrder as number),
        ) + 1,
      );
      expect(library.warnings).toEqual(
        expect.arrayContaining([
          expect.objectContaining({ kind: 'overlap', system: 'Q', classes: ['SC-B', 'SC-B2'] }),
          expect.objectContaining({ kind: 'overlap', system: 'RMR89', classes: ['SC-B', 'SC-B2'] }),
        ]),
      );

      const idOf = (code: string): string =>
        (library.classes as Body[]).find((c) => c.code === code)!.id as string;
      const reordered = ['SC-A', 'SC-B', 'SC-B2', 'SC-C', 'SC-D', 'SC-E'].map(idOf);
      const afterOrder = await request(http)
        .put(`${base}/support-classes/order`)
        .set(as('admin'))
        .send({ ids: reordered })
        .expect(200);
      expect((afterOrder.body.classes as Body[]).map((c) => c.code)).toEqual([
        'SC-A',
        'SC-B',
        'SC-B2',
        'SC-C',
        'SC-D',
        'SC-E',
      ]);
      await request(http)
        .put(`${base}/support-classes/order`)
        .set(as('admin'))
        .send({ ids: reordered.slice(1) })
        .expect(409);

      // Reordering changed SC-B2's position, so its version moved on.
      const b2Now = (afterOrder.body.classes as Body[]).find((c) => c.id === b2.id)!;
      expect(b2Now.version).toBe((b2.version as number) + 1);
      const retired = await request(http)
        .patch(`${base}/support-classes/${b2.id}`)
        .set(as('admin'))
        .send({ retired: true, version: b2Now.version })
        .expect(200);
      expect(retired.body.warnings).toEqual([]);
      expect(await lastAudit(b2.id as string)).toMatchObject({
        action: 'retire',
        before: { retired: false },
        after: { retired: true },
      });
      await request(http)
        .patch(`${base}/support-classes/${b2.id}`)
        .set(as('admin'))
        .send({ notes: 'late', version: b2Now.version })
        .expect(409);

      const removed = await request(http)
        .delete(`${base}/support-classes/${b2.id}`)
        .set(as('admin'))
        .expect(200);
      expect((removed.body.classes as Body[]).map((c) => c.code)).not.toContain('SC-B2');
      expect(await lastAudit(b2.id as string)).toMatchObject({
        action: 'delete',
        before: expect.objectContaining({ code: 'SC-B2' }),
      });
    });
  });

  describe('trigger rules', () => {
    it('covers every watched quantity in the demo, red first, each with its summary', async () => {
      const res = await request(http).get(`${base}/trigger-rules`).set(as('viewer')).expect(200);
      const rules = res.body as Body[];
      expect(new Set(rules.map((r) => r.watch))).toEqual(
        new Set([
          'q',
          'rmr89',
          'inflow-per-10m',
          'overbreak',
          'adverse-orientation',
          'crown-crossing-within',
          'support-class-change',
          'open-red-hazard',
        ]),
      );
      expect(rules[0].level).toBe('red');
      expect(rules.map((r) => r.summary)).toContain('Q < 0.1 → red');
    });

    it('previews a rule against the demo rounds without saving it', async () => {
      const q = await request(http)
        .post(`${base}/trigger-rules/preview`)
        .set(as('engineer'))
        .send({
          watch: 'q',
          comparison: '<',
          threshold: 1,
          level: 'amber',
          action: 'Review.',
          ownerRole: 'engineer',
          timeAllowedHours: 4,
        })
        .expect(200);
      expect(q.body.evaluatedRounds).toBeGreaterThanOrEqual(28);
      expect(q.body.matches.length).toBeGreaterThan(0);
      const demo = (q.body.matches as Body[]).filter((m) =>
        ['HR-U', 'HR-D'].includes(m.headingCode as string),
      );
      expect((q.body.matches as Body[]).every((m) => m.value < 1)).toBe(true);
      expect(demo.map((m) => m.roundNumber).sort((a, b) => a - b)).toEqual([13, 14, 15, 16, 17, 18]); // the fault zone on HR-U
      const change = await request(http)
        .post(`${base}/trigger-rules/preview`)
        .set(as('admin'))
        .send({
          watch: 'support-class-change',
          level: 'amber',
          action: 'Confirm.',
          ownerRole: 'engineer',
          timeAllowedHours: 4,
        })
        .expect(200);
      expect((change.body.matches as Body[]).map((m) => `${m.headingCode}#${m.roundNumber}`)).toEqual(
        // Issue 10 demo: RQD now follows the joint spacing (Jv) and the fault rounds take Jr/Ja from the fault,
        // so the class changes move to HR-U#12 (spacing closing), HR-U#13 (the fault) and HR-D#7.
        expect.arrayContaining(['HR-U#12', 'HR-U#13', 'HR-D#7']),
      );
      const hazard = await request(http)
        .post(`${base}/trigger-rules/preview`)
        .set(as('admin'))
        .send({
          watch: 'open-red-hazard',
          level: 'red',
          action: 'Stop.',
          ownerRole: 'supervisor',
          timeAllowedHours: 1,
        })
        .expect(200);
      expect(hazard.body).toMatchObject({
        evaluatedRounds: 0,
        matches: [],
        notEvaluated: expect.stringMatching(/Hazards/),
      });
      await request(http).post(`${base}/trigger-rules/preview`).set(as('geologist')).send({}).expect(403);
      const rules = (await request(http).get(`${base}/trigger-rules`).set(as('admin')).expect(200))
        .body as Body[];
      expect(rules.some((r) => r.action === 'Review.')).toBe(false); // nothing saved
    });

    it('lets engineers and admins edit rules, checks threshold against what is watched, and audits', async () => {
      await request(http).post(`${base}/trigger-rules`).set(as('geologist')).send({}).expect(403);
      const noThreshold = await request(http)
        .post(`${base}/trigger-rules`)
        .set(as('engineer'))
        .send({
          watch: 'rmr89',
          comparison: '<',
          level: 'red',
          action: 'Stop and call the designer.',
          ownerRole: 'engineer',
          timeAllowedHours: 1,
        })
        .expect(400);
      expect(noThreshold.body.fields).toEqual({ threshold: 'Give the threshold.' });
      const flagWithComparison = await request(http)
        .post(`${base}/trigger-rules`)
        .set(as('engineer'))
        .send({
          watch: 'open-red-hazard',
          comparison: '>',
          threshold: 1,
          level: 'red',
          action: 'Make it safe.',
          ownerRole: 'supervisor',
          timeAllowedHours: 1,
        })
        .expect(400);
      expect(Object.keys(flagWithComparison.body.fields as object).sort()).toEqual([
        'comparison',
        'threshold',
      ]);

      const created = await request(http)
        .post(`${base}/trigger-rules`)
        .set(as('engineer'))
        .send({
          watch: 'rmr89',
          comparison: '<',
          threshold: 20,
          level: 'red',
          action: 'Stop and call the designer.',
          ownerRole: 'engineer',
          timeAllowedHours: 1,
        })
        .expect(201);
      const rule = created.body as Body;
      expect(rule.summary).toBe('RMR89 < 20 → red');
      const changed = await request(http)
        .patch(`${base}/trigger-rules/${rule.id}`)
        .set(as('admin'))
        .send({ threshold: 18, version: 1 })
        .expect(200);
      expect(changed.body).toMatchObject({ threshold: 18, version: 2 });
      expect(await lastAudit(rule.id as string)).toMatchObject({
        action: 'update',
        before: { threshold: 20 },
        after: { threshold: 18 },
      });
      await request(http).delete(`${base}/trigger-rules/${rule.id}`).set(as('engineer')).expect(204);
      expect(await lastAudit(rule.id as string)).toMatchObject({ action: 'delete' });
    });
  });

  // The team and invitation tests moved to invitations.e2e-spec.ts (e-mail now goes through the jobs worker).

  describe('a new project from scratch', () => {
    it('lets a signed-in person create a project and become its admin; a taken code lands on the field', async () => {
      const ds = app.get(DataSource);
      const lead = await ds.getRepository(User).save({
        email: `lead.${run}@roundbook.test`,
        name: 'Invented Project Lead',
        passwordHash: await hashPassword('a-long-enough-pw'),
      });
      const token = (
        (
          await request(http)
            .post('/api/auth/login')
            .send({ email: lead.email, password: 'a-long-enough-pw' })
            .expect(200)
        ).body as Body
      ).accessToken as string;
      const bad = await request(http)
        .post('/api/projects')
        .set('Authorization', `Bearer ${token}`)
        .send({ code: 'BRH', name: 'Clash', timeZone: 'Atlantis/Deep' })
        .expect(400);
      expect(bad.body.fields).toEqual({ timeZone: expect.stringMatching(/time zone/) });
      const taken = await request(http)
        .post('/api/projects')
        .set('Authorization', `Bearer ${token}`)
        .send({ code: 'BRH', name: 'Clash', timeZone: 'Europe/Oslo' })
        .expect(409);
      expect(taken.body.fields).toEqual({ code: 'This code is already used.' });
      const created = await request(http)
        .post('/api/projects')
        .set('Authorization', `Bearer ${token}`)
        .send({
          code: `NP${run}`,
          name: 'Invented pressure shaft',
          client: 'Invented client',
          timeZone: 'America/Lima',
          groundScale: 'iso-14689',
        })
        .expect(201);
      expect(created.body).toMatchObject({
        role: 'admin',
        headings: [],
        distributionList: [],
        groundScale: 'iso-14689',
        qTableEdition: '2015',
      });
      const mine = await request(http)
        .get('/api/projects')
        .set('Authorization', `Bearer ${token}`)
        .expect(200);
      expect((mine.body as Body[]).map((p) => [p.code, p.role])).toEqual([[`NP${run}`, 'admin']]);
      // The new admin can set it up straight away.
      await request(http)
        .post(`/api/projects/${created.body.id}/headings`)
        .set('Authorization', `Bearer ${token}`)
        .send({
          code: 'MAIN',
          name: 'Main drive',
          startChainage: 0,
          driveTrend: 10,
          gradientPercent: 12,
          profileShape: 'd-shaped',
          profileWidth: 4,
          profileHeight: 4.5,
          axisHeight: 2,
          stages: ['full-face'],
          plannedRoundLength: 2.5,
        })
        .expect(201);
    });
  });

  describe('project settings', () => {
    it('keeps a distribution list of valid addresses and names a bad one', async () => {
      const current = (await request(http).get(base).set(as('admin')).expect(200)).body as Body;
      expect(current.distributionList).toEqual(
        expect.arrayContaining(['shift-office@brannoch-works.test', 'design-team@brannoch-works.test']),
      );
      const bad = await request(http)
        .patch(base)
        .set(as('admin'))
        .send({ distributionList: ['ok@site.test', 'not-an-address'], version: current.version })
        .expect(400);
      expect(Object.keys(bad.body.fields as object)).toEqual(['distributionList']);
      const ok = await request(http)
        .patch(base)
        .set(as('admin'))
        .send({
          distributionList: [...(current.distributionList as string[]), 'night-shift@brannoch-works.test'],
          version: current.version,
        })
        .expect(200);
      expect(ok.body.distributionList).toHaveLength((current.distributionList as string[]).length + 1);
      expect(await lastAudit(projectId)).toMatchObject({
        action: 'update',
        after: { distributionList: expect.arrayContaining(['night-shift@brannoch-works.test']) },
      });
      await request(http)
        .patch(base)
        .set(as('admin'))
        .send({ distributionList: current.distributionList, version: ok.body.version })
        .expect(200);
    });

    it('lists the audit trail with the names of the people who changed things', async () => {
      const res = await request(http).get(`${base}/audit?limit=5`).set(as('viewer')).expect(200);
      expect((res.body as Body[]).length).toBeGreaterThan(0);
      expect((res.body as Body[])[0]).toMatchObject({ actorName: 'Ines Carrow', entityType: 'project' });
    });
  });
});
