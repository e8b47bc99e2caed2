import { array, boolean, mixed, number, object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type {
  GroundScale,
  PlaneNotation,
  ProjectSummary,
  QTableEdition,
  UpdateProjectRequest,
} from '@/api/contract';

/** The settings this form edits. */
export type ProjectSettingsValues = Required<Omit<UpdateProjectRequest, 'version'>>;

export const PLANE_NOTATIONS: PlaneNotation[] = ['dip-direction/dip', 'dip/dip-direction', 'strike/dip-rhr'];
export const notationLabels: Record<PlaneNotation, string> = {
  'dip-direction/dip': 'Dip direction / dip (e.g. 135/60)',
  'dip/dip-direction': 'Dip / dip direction (e.g. 60/135)',
  'strike/dip-rhr': 'Strike / dip, right-hand rule (e.g. 045/60)',
};
export const Q_EDITIONS: QTableEdition[] = ['2015'];
export const GROUND_SCALES: GroundScale[] = ['isrm', 'iso-14689'];
export const groundScaleLabels: Record<GroundScale, string> = {
  isrm: 'ISRM suggested methods',
  'iso-14689': 'ISO 14689',
};

export function knownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

export const projectSettingsSchema: ObjectSchema<ProjectSettingsValues> = object({
  name: string().trim().required('Give the project a name.').max(160, 'Up to 160 characters.'),
  client: string().trim().max(160, 'Up to 160 characters.').default('').defined(),
  timeZone: string()
    .trim()
    .required('Choose the time zone shift dates follow.')
    .test('zone', 'Choose a time zone such as Europe/Zurich.', (zone) => knownTimeZone(zone)),
  defaultNotation: mixed<PlaneNotation>().oneOf(PLANE_NOTATIONS).required(),
  qTableEdition: mixed<QTableEdition>().oneOf(Q_EDITIONS).required(),
  groundScale: mixed<GroundScale>().oneOf(GROUND_SCALES).required(),
  distributionList: array(
    string()
      .trim()
      .required('Fill in the address or remove the line.')
      .email('Each entry must be an e-mail address such as name@example.org.'),
  )
    .required()
    .max(50, 'Up to 50 addresses.')
    .test(
      'unique',
      'An address is listed twice.',
      (list) => new Set(list.map((a) => a.toLowerCase())).size === list.length,
    ),
  coordinateGrid: string().trim().max(120, 'Up to 120 characters.').default('').defined(),
  handoverAckMinutes: number()
    .transform((value: number, original: unknown) =>
      typeof original === 'string' && original.trim() === '' ? Number.NaN : value,
    )
    .typeError('Give the time in whole minutes, e.g. 60.')
    .required('Give the time in whole minutes, e.g. 60.')
    .integer('Give the time in whole minutes, e.g. 60.')
    .min(5, 'Allow at least 5 minutes to acknowledge a handover.')
    .max(720, 'Allow at most 720 minutes (12 hours, one shift).'),
  separationOfDuties: boolean().required(),
});

export function projectToSettingsValues(p: ProjectSummary): ProjectSettingsValues {
  return {
    name: p.name,
    client: p.client,
    timeZone: p.timeZone,
    defaultNotation: p.defaultNotation,
    qTableEdition: p.qTableEdition,
    groundScale: p.groundScale,
    distributionList: [...p.distributionList],
    coordinateGrid: p.coordinateGrid,
    handoverAckMinutes: p.handoverAckMinutes,
    separationOfDuties: p.separationOfDuties,
  };
}

export const projectSettingsLabels: Partial<Record<keyof ProjectSettingsValues, string>> = {
  name: 'Project name',
  client: 'Client',
  timeZone: 'Time zone',
  defaultNotation: 'Orientation notation',
  qTableEdition: 'Q table edition',
  groundScale: 'Weathering and strength grades',
  distributionList: 'Handover distribution list',
  coordinateGrid: 'Coordinate grid',
  handoverAckMinutes: 'Time to acknowledge a handover',
  separationOfDuties: 'Separation of duties',
};
