import 'reflect-metadata';
import { performance } from 'node:perf_hooks';
import { DataSource } from 'typeorm';
import { loadAppConfig } from '../config/app-config.js';
import { databaseOptions } from '../database/options.js';
import { Heading } from '../modules/headings/heading.entity.js';
import type { HeadingsService } from '../modules/headings/headings.service.js';
import { Project } from '../modules/projects/project.entity.js';
import type { RoundAssessor } from '../modules/rounds/round-assessor.service.js';
import { RoundsQueries } from '../modules/rounds/rounds.queries.js';
import { User } from '../modules/users/user.entity.js';
import { benchHeading } from './bench-heading.js';

/**
 * Benchmark: the Rounds tab of a heading with 30,000 rounds. Times RoundsQueries.list (the query behind
 * GET …/rounds) for the first page, a deep page and a filtered sort, against the same queries forced to
 * scan the table without its index (IGNORE INDEX), measured in the same run. Run by `npm run bench`
 * (infra/bench.mjs starts the test database first).
 */
const N = 30_000;
/** Other headings' rounds in the same table, as on a project with several faces. */
const OTHER_HEADINGS = 3;

async function time(fn: () => Promise<unknown>, runs = 15): Promise<number> {
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    samples.push(performance.now() - t0);
  }
  samples.sort((a, b) => a - b);
  return samples[Math.floor(samples.length / 2)];
}

async function main(): Promise<void> {
  const ds = await new DataSource(databaseOptions(loadAppConfig())).initialize();
  try {
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const mapper = await ds.getRepository(User).findOneByOrFail({ email: 'geologist@roundbook.test' });
    const heading = await benchHeading(ds, project.id, 'BENCH', 'Invented benchmark heading');
    const others: string[] = [];
    for (let k = 0; k < OTHER_HEADINGS; k++) {
      const { id: _id, version: _v, createdAt: _c, updatedAt: _u, ...shape } = heading;
      others.push((await ds.getRepository(Heading).save({ ...shape, code: `${heading.code}-${k}` })).id);
    }
    const t0 = performance.now();
    for (const target of [heading.id, ...others]) {
      await ds.query(
        `INSERT INTO rounds (id, project_id, heading_id, stage, round_number, face_chainage, previous_chainage, round_length, shift_date, shift,
         mapped_by, mapped_at, distant_parts, ground, q, rmr, recommendation_reason, status, version)
       SELECT UUID(), ?, ?, 'full-face', seq, 1000 + seq * 2.5, 1000 + (seq - 1) * 2.5, 2.5, DATE_ADD('2020-01-01', INTERVAL seq DIV 4 DAY),
         IF(seq % 2 = 0, 'day', 'night'), ?, NOW(3), '', '{}', POW(10, CAST(seq % 7 AS SIGNED) - 3), 20 + seq % 60, '',
         IF(seq % 10 = 0, 'submitted', 'draft'), 1
       FROM seq_1_to_${N}`,
        [project.id, target, mapper.id],
      );
    }
    console.log(
      `rounds list: ${N.toLocaleString('en')} rounds on the benchmark heading and ${(N * OTHER_HEADINGS).toLocaleString('en')} on ${OTHER_HEADINGS} others, inserted in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );
    // The list reads the heading through HeadingsService and never assesses: only what it calls is given.
    const headings = {
      findForProject: (projectId: string, id: string) =>
        ds.getRepository(Heading).findOneBy({ id, projectId }),
    } as unknown as HeadingsService;
    const sut = new RoundsQueries(ds, headings, {} as RoundAssessor);
    const access = { projectId: project.id, role: 'viewer' as const };
    // The reference does the same work (a page and the total count) with the table's indexes ignored.
    const noIndex = `IGNORE INDEX (${[
      'IDX_rounds_heading_chainage',
      'IDX_rounds_heading_status_face',
      'IDX_rounds_heading_status_confirmed',
      'IDX_rounds_heading_date',
      'IDX_rounds_heading_q',
      'IDX_rounds_heading_rmr',
      'IDX_rounds_heading_mapped',
      'IDX_rounds_heading_progress',
      'UQ_rounds_heading_stage_number',
    ].join(', ')})`;
    const scan = async (order: string, where = '', offset = 0): Promise<unknown> => {
      await ds.query(`SELECT COUNT(*) AS n FROM rounds r ${noIndex} WHERE r.heading_id = ? ${where}`, [
        heading.id,
      ]);
      return ds.query<unknown>(
        `SELECT r.id, r.round_number, r.face_chainage, r.q, r.rmr, r.status FROM rounds r ${noIndex}
         WHERE r.heading_id = ? ${where} ORDER BY ${order} LIMIT 50 OFFSET ${offset}`,
        [heading.id],
      );
    };
    const cases: Array<[string, () => Promise<unknown>, () => Promise<unknown>]> = [
      [
        'first page, newest face first',
        () => sut.list(access, heading.id, { sort: '-faceChainage', pageSize: 50 }),
        () => scan('r.face_chainage DESC'),
      ],
      [
        'page 500 of 600',
        () => sut.list(access, heading.id, { sort: '-faceChainage', pageSize: 50, page: 500 }),
        () => scan('r.face_chainage DESC', '', 24950),
      ],
      [
        'submitted only, lowest Q first',
        () => sut.list(access, heading.id, { status: 'submitted', sort: 'q', pageSize: 50 }),
        () => scan('r.q ASC', "AND r.status = 'submitted'"),
      ],
    ];
    for (const [name, ours, reference] of cases) {
      await ours();
      await reference();
      const a = await time(ours);
      const b = await time(reference);
      console.log(
        `  ${name.padEnd(32)} list ${a.toFixed(1)} ms (page + total count)   same work without indexes ${b.toFixed(1)} ms   ratio ${(b / a).toFixed(1)}×`,
      );
    }
    for (const id of [heading.id, ...others]) {
      await ds.query('DELETE FROM rounds WHERE heading_id = ?', [id]);
      await ds.getRepository(Heading).delete({ id });
    }
  } finally {
    await ds.destroy();
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
