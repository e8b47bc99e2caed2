import 'reflect-metadata';
import { performance } from 'node:perf_hooks';
import { DataSource } from 'typeorm';
import { loadAppConfig } from '../config/app-config.js';
import { databaseOptions } from '../database/options.js';

/**
 * The large project of the load run (infra/load.mjs), written in bulk SQL after the demo seed: the demo
 * project gains two headings (invented, LD1 and LD2) with ROUNDS rounds in all and JOINTS_PER_ROUND joints
 * each. Every round is a copy of one of the demo's handed-in rounds (its ground, Q and RMR inputs, ratings,
 * recommended class and frozen assessment, all computed by packages/domain when the demo was seeded), moved
 * to its own number, chainage and shift; each round's joints are copies of that demo round's joints. The
 * last DRAFTS rounds of each heading are drafts (what the joint edits of the load run save). Prints one
 * JSON line with the ids the load run needs.
 *
 * Runs in seconds: INSERT … SELECT over MariaDB's sequence engine (seq_1_to_N), not one insert per row.
 */
const ROUNDS = Number(process.env.LOAD_ROUNDS ?? 30_000);
const HEADINGS = 2;
const JOINTS_PER_ROUND = 15;
const DRAFTS = 30;

type Row = Record<string, unknown>;

async function columnsOf(ds: DataSource, table: string): Promise<string[]> {
  const rows = await ds.query<Array<{ name: string }>>(
    `SELECT COLUMN_NAME AS name FROM information_schema.COLUMNS
      WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? ORDER BY ORDINAL_POSITION`,
    [table],
  );
  return rows.map((r) => r.name);
}

/** `INSERT INTO table (all columns) SELECT <override or t.column> …`: a copy with some columns replaced. */
async function copySql(
  ds: DataSource,
  table: string,
  overrides: Record<string, string>,
  from: string,
): Promise<string> {
  const cols = await columnsOf(ds, table);
  const unknown = Object.keys(overrides).filter((c) => !cols.includes(c));
  if (unknown.length) throw new Error(`${table} has no column(s) ${unknown.join(', ')}`);
  return `INSERT INTO \`${table}\` (${cols.map((c) => `\`${c}\``).join(', ')})
          SELECT ${cols.map((c) => overrides[c] ?? `t.\`${c}\``).join(', ')} ${from}`;
}

async function main(): Promise<void> {
  const ds = await new DataSource(databaseOptions(loadAppConfig())).initialize();
  const t0 = performance.now();
  try {
    const [project] = await ds.query<Row[]>(`SELECT id FROM projects WHERE code = 'BRH'`);
    if (!project) throw new Error('The demo project (BRH) is missing: seed the demo first.');
    const projectId = String(project.id);
    const [template] = await ds.query<Row[]>(
      `SELECT h.id, h.planned_round_length AS len, COUNT(*) AS n FROM headings h JOIN rounds r ON r.heading_id = h.id
        WHERE h.project_id = ? AND r.status <> 'draft' AND r.assessment IS NOT NULL
        GROUP BY h.id, h.planned_round_length ORDER BY n DESC LIMIT 1`,
      [projectId],
    );
    if (!template) throw new Error('The demo has no handed-in round to copy.');
    const existing = await ds.query<Row[]>(
      `SELECT COUNT(*) AS n FROM headings WHERE project_id = ? AND code LIKE 'LD%'`,
      [projectId],
    );
    if (Number(existing[0].n) > 0)
      throw new Error('The load headings exist already (seed a fresh database).');

    // The templates: the demo's handed-in rounds of one heading, numbered 0…K-1, and their joints, copied
    // into tables of their own (an INSERT … SELECT from the table it fills needs an internal temporary table
    // of the JSON columns, which failed here).
    await ds.query(`DROP TABLE IF EXISTS load_templates, load_template_joints`);
    await ds.query(
      `CREATE TABLE load_templates ENGINE=InnoDB AS
         SELECT ROW_NUMBER() OVER (ORDER BY round_number) - 1 AS k, r.*
           FROM rounds r WHERE r.heading_id = ? AND r.status <> 'draft' AND r.assessment IS NOT NULL`,
      [template.id],
    );
    await ds.query(
      `CREATE TABLE load_template_joints ENGINE=InnoDB AS
         SELECT lt.k, COUNT(*) OVER (PARTITION BY lt.k) AS n, j.* FROM joints j JOIN load_templates lt ON lt.id = j.round_id`,
    );
    const k = Number((await ds.query<Row[]>(`SELECT COUNT(*) AS n FROM load_templates`))[0].n);
    const perHeading = Math.ceil(ROUNDS / HEADINGS);
    const len = Number(template.len) || 3;
    const headingIds: string[] = [];
    for (let h = 1; h <= HEADINGS; h++) {
      const id = String((await ds.query<Row[]>(`SELECT UUID() AS id`))[0].id);
      await ds.query(
        await copySql(
          ds,
          'headings',
          {
            id: '?',
            code: `'LD${h}'`,
            name: `'Load heading ${h} (invented, ${perHeading.toLocaleString('en')} rounds)'`,
            start_chainage: `${h * 100000}`,
            version: '1',
          },
          `FROM headings t WHERE t.id = ?`,
        ),
        [id, template.id],
      );
      headingIds.push(id);
      // Round s of this heading copies template s mod K; the heading advances one planned length a round,
      // two rounds a day (day and night shift), the last one mapped today.
      await ds.query(
        await copySql(
          ds,
          'rounds',
          {
            id: 'UUID()',
            heading_id: '?',
            stage: "'full-face'",
            round_number: 's.seq',
            face_chainage: `${h * 100000} + s.seq * ${len}`,
            previous_chainage: `${h * 100000} + (s.seq - 1) * ${len}`,
            round_length: `${len}`,
            shift_date: `DATE_SUB(CURRENT_DATE(), INTERVAL (${perHeading} - s.seq) DIV 2 DAY)`,
            shift: "IF(s.seq % 2 = 0, 'night', 'day')",
            mapped_at: `DATE_SUB(NOW(3), INTERVAL (${perHeading} - s.seq) * 12 HOUR)`,
            submitted_at: `IF(s.seq > ${perHeading - DRAFTS}, NULL, DATE_SUB(NOW(3), INTERVAL (${perHeading} - s.seq) * 12 - 1 HOUR))`,
            status: `IF(s.seq > ${perHeading - DRAFTS}, 'draft', IF(s.seq > ${perHeading - DRAFTS - 40}, 'submitted', t.status))`,
            confirmed_class_id: `IF(s.seq > ${perHeading - DRAFTS - 40}, NULL, t.confirmed_class_id)`,
            confirmed_round_length: `IF(s.seq > ${perHeading - DRAFTS - 40}, NULL, t.confirmed_round_length)`,
            confirmed_at: `IF(s.seq > ${perHeading - DRAFTS - 40}, NULL, t.confirmed_at)`,
            version: '1',
          },
          `FROM seq_1_to_${perHeading} s JOIN load_templates t ON t.k = s.seq % ${k}`,
        ),
        [id],
      );
      // Each round's joints: its template's joints, repeated until there are JOINTS_PER_ROUND.
      await ds.query(
        await copySql(
          ds,
          'joints',
          {
            id: 'UUID()',
            round_id: 'r.id',
            heading_id: 'r.heading_id',
            face_chainage: 'r.face_chainage',
            seq: '(c.seq - 1) * t.n + t.seq',
          },
          `FROM rounds r JOIN load_template_joints t ON t.k = r.round_number % ${k}
             JOIN seq_1_to_${JOINTS_PER_ROUND} c ON (c.seq - 1) * t.n + t.seq <= ${JOINTS_PER_ROUND}
            WHERE r.heading_id = ?`,
        ),
        [id],
      );
    }
    await ds.query(`DROP TABLE load_templates, load_template_joints`);
    await ds.query(`ANALYZE TABLE rounds, joints`);
    const [{ rounds }] = await ds.query<Row[]>(
      `SELECT COUNT(*) AS rounds FROM rounds WHERE heading_id IN (?)`,
      [headingIds],
    );
    const [{ joints }] = await ds.query<Row[]>(
      `SELECT COUNT(*) AS joints FROM joints WHERE heading_id IN (?)`,
      [headingIds],
    );
    const drafts = await ds.query<Row[]>(
      `SELECT id, heading_id AS headingId FROM rounds WHERE heading_id IN (?) AND status = 'draft' ORDER BY round_number`,
      [headingIds],
    );
    const sample = await ds.query<Row[]>(
      `SELECT id FROM rounds WHERE heading_id IN (?) AND status <> 'draft' ORDER BY RAND(7) LIMIT 200`,
      [headingIds],
    );
    console.log(
      JSON.stringify({
        projectId,
        headingIds,
        rounds: Number(rounds),
        joints: Number(joints),
        templates: k,
        plannedRoundLength: len,
        seconds: Math.round((performance.now() - t0) / 100) / 10,
        draftRoundIds: drafts.map((d) => String(d.id)),
        roundIds: sample.map((s) => String(s.id)),
      }),
    );
  } finally {
    await ds.destroy();
  }
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? (e.stack ?? e.message) : String(e));
  process.exit(1);
});
