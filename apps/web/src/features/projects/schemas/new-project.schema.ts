import { mixed, object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type { CreateProjectRequest, GroundScale, PlaneNotation } from '@/api/contract';
import {
  GROUND_SCALES,
  knownTimeZone,
  PLANE_NOTATIONS,
} from '@/features/projects/schemas/project-settings.schema';

export type NewProjectValues = Required<CreateProjectRequest>;

/** The same rule as the API: a short code of letters, digits, dots, dashes or underscores. */
export const PROJECT_CODE = /^[A-Za-z0-9][A-Za-z0-9._-]{0,19}$/;

export const newProjectSchema: ObjectSchema<NewProjectValues> = object({
  code: string()
    .trim()
    .required('Give the project a short code, e.g. BRH.')
    .max(20, 'Up to 20 characters.')
    .matches(
      PROJECT_CODE,
      'Use letters, digits, dots, dashes or underscores, starting with a letter or digit.',
    ),
  name: string().trim().required('Give the project a name.').max(160, 'Up to 160 characters.'),
  client: string().trim().max(160, 'Up to 160 characters.').default('').defined(),
  timeZone: string()
    .trim()
    .required('Choose the time zone shift dates follow.')
    .test('zone', 'Choose a time zone such as Europe/Zurich.', (zone) => knownTimeZone(zone)),
  defaultNotation: mixed<PlaneNotation>().oneOf(PLANE_NOTATIONS).required(),
  groundScale: mixed<GroundScale>().oneOf(GROUND_SCALES).required(),
});

/** The time zone this device is set to, when the browser can tell; else UTC. */
export function deviceTimeZone(): string {
  try {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return zone !== undefined && zone !== '' && knownTimeZone(zone) ? zone : 'UTC';
  } catch {
    return 'UTC';
  }
}

export function emptyNewProject(timeZone: string = deviceTimeZone()): NewProjectValues {
  return {
    code: '',
    name: '',
    client: '',
    timeZone,
    defaultNotation: 'dip-direction/dip',
    groundScale: 'isrm',
  };
}
