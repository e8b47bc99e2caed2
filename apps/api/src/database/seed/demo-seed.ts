import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import type { ProjectRole } from '../../common/auth/auth-user.js';
import { Heading } from '../../modules/headings/heading.entity.js';
import { ProjectMember } from '../../modules/projects/project-member.entity.js';
import { Project } from '../../modules/projects/project.entity.js';
import { SupportClass } from '../../modules/support-classes/support-class.entity.js';
import { TriggerRule } from '../../modules/trigger-rules/trigger-rule.entity.js';
import { hashPassword } from '../../modules/users/password.js';
import { User } from '../../modules/users/user.entity.js';
import { seedDemoRounds, type DemoRoundsPlan } from './demo-rounds.js';

interface Scenario {
  project: Pick<
    Project,
    | 'code'
    | 'name'
    | 'client'
    | 'timeZone'
    | 'qTableEdition'
    | 'defaultNotation'
    | 'distributionList'
    | 'coordinateGrid'
  >;
  headings: Array<Omit<Heading, 'id' | 'projectId' | 'project' | 'createdAt' | 'updatedAt' | 'version'>>;
  supportClasses: Array<
    Omit<SupportClass, 'id' | 'projectId' | 'sortOrder' | 'retired' | 'createdAt' | 'updatedAt' | 'version'>
  >;
  triggerRules: Array<
    Omit<TriggerRule, 'id' | 'projectId' | 'enabled' | 'createdAt' | 'updatedAt' | 'version'>
  >;
  users: Array<{ email: string; name: string; role: ProjectRole }>;
  rounds: DemoRoundsPlan[];
}

/** The demo user who is the instance operator. */
export const DEMO_OPERATOR_EMAIL = 'admin@roundbook.test';

export const scenarioFile = (): string =>
  path.resolve(__dirname, '../../../../../fixtures/demo/scenario.json');

/**
 * Seeds the invented demo scenario when the database holds no users and no projects; never writes over
 * existing data. Returns whether it seeded.
 */
export async function seedDemo(
  dataSource: DataSource,
  password: string,
  file = scenarioFile(),
): Promise<boolean> {
  const scenario = JSON.parse(readFileSync(file, 'utf8')) as Scenario;
  const hash = await hashPassword(password);
  return dataSource.transaction(async (manager) => {
    const [users, projects] = await Promise.all([manager.count(User), manager.count(Project)]);
    if (users > 0 || projects > 0) return false;
    const project = await manager.save(manager.create(Project, scenario.project));
    for (const h of scenario.headings)
      await manager.save(manager.create(Heading, { ...h, projectId: project.id }));
    for (const [i, c] of scenario.supportClasses.entries()) {
      await manager.save(
        manager.create(SupportClass, { ...c, projectId: project.id, sortOrder: i + 1, retired: false }),
      );
    }
    for (const r of scenario.triggerRules) {
      await manager.save(manager.create(TriggerRule, { ...r, projectId: project.id, enabled: true }));
    }
    for (const u of scenario.users) {
      const user = await manager.save(
        manager.create(User, {
          email: u.email,
          name: u.name,
          passwordHash: hash,
          // The demo admin also runs the instance (local mail view, jobs, creating projects).
          isOperator: u.email === DEMO_OPERATOR_EMAIL,
        }),
      );
      await manager.save(
        manager.create(ProjectMember, { projectId: project.id, userId: user.id, role: u.role }),
      );
    }
    const classes = await manager.find(SupportClass, {
      where: { projectId: project.id },
      order: { sortOrder: 'ASC' },
    });
    const geologist = await manager.findOneByOrFail(User, {
      email: scenario.users.find((u) => u.role === 'geologist')!.email,
    });
    const engineer = await manager.findOneByOrFail(User, {
      email: scenario.users.find((u) => u.role === 'engineer')!.email,
    });
    for (const plan of scenario.rounds) {
      const heading = await manager.findOneByOrFail(Heading, { projectId: project.id, code: plan.heading });
      await seedDemoRounds(manager, plan, heading, classes, geologist.id, {
        id: engineer.id,
        name: engineer.name,
      });
    }
    return true;
  });
}
