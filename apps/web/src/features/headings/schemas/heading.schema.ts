import {
  formatChainage,
  gradientDegreesToPercent,
  gradientPercentToDegrees,
  parseChainage,
} from '@roundbook/geomath';
import { array, mixed, number, object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type {
  ChainageStyle,
  CreateHeadingRequest,
  ExcavationStage,
  Heading,
  ProfileShape,
} from '@/api/contract';
import { PROFILE_SHAPES, STAGES } from '@/features/headings/utils/labels';

export type GradientUnit = 'percent' | 'degrees';

/** What the heading form holds: numbers as typed (so a half-typed value is never lost). */
export interface HeadingFormValues {
  code: string;
  name: string;
  startChainage: string;
  chainageStyle: ChainageStyle;
  chainageDecimals: string;
  driveTrend: string;
  gradient: string;
  gradientUnit: GradientUnit;
  profileShape: ProfileShape | '';
  profileWidth: string;
  profileHeight: string;
  axisHeight: string;
  stages: ExcavationStage[];
  plannedRoundLength: string;
  startEasting: string;
  startNorthing: string;
  startElevation: string;
  chainageSense: ChainageSense;
  initialBearing: string;
  /** One segment a line: "120" (a straight of 120 m) or "80 300 right" (an arc of 80 m, radius 300 m, turning right). */
  alignmentSegments: string;
  benchHeight: string;
}

export type ChainageSense = 'increasing' | 'decreasing';
export interface AlignmentSegmentInput {
  length: number;
  radius: number | null;
  side: 'left' | 'right' | null;
}

/** Reads the segments text, one a line; throws an Error naming the line that cannot be read. */
export function parseSegments(text: string): AlignmentSegmentInput[] {
  return text
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l !== '')
    .map((line, i) => {
      const parts = line.replace(/,/g, '.').split(/\s+/);
      const length = Number(parts[0]);
      if (!(length > 0)) throw new Error(`Line ${i + 1}: start with the length in metres, more than 0.`);
      if (parts.length === 1) return { length, radius: null, side: null };
      const radius = Number(parts[1]);
      const side = parts[2]?.toLowerCase();
      if (!(radius >= 1) || (side !== 'left' && side !== 'right') || parts.length > 3)
        throw new Error(
          `Line ${i + 1}: an arc is its length, radius (1 m or more) and left or right, e.g. 80 300 right.`,
        );
      return { length, radius, side };
    });
}

/** The segments as text for the form, one a line. */
export function segmentsText(segments: AlignmentSegmentInput[] | undefined): string {
  return (segments ?? [])
    .map((s) => (s.radius === null ? String(s.length) : `${s.length} ${s.radius} ${s.side ?? 'right'}`))
    .join('\n');
}

/** The checked form: the API's heading with the gradient still in the unit it was typed in. */
export type HeadingInput = Required<Omit<CreateHeadingRequest, 'gradientPercent'>> & {
  gradient: number;
  gradientUnit: GradientUnit;
};

const MAX_GRADIENT_PERCENT = 30;
const MAX_GRADIENT_DEGREES = gradientPercentToDegrees(MAX_GRADIENT_PERCENT);

/** Reads a typed number; a comma works as the decimal mark; empty is "not given". */
export function typedNumber(original: unknown): number | undefined {
  if (typeof original === 'number') return original;
  if (typeof original !== 'string' || original.trim() === '') return undefined;
  const text = original.trim().replace(',', '.');
  return /^[-+−]?(\d+\.?\d*|\.\d+)$/.test(text) ? Number(text.replace('−', '-')) : Number.NaN;
}

const decimalNumber = (typeError: string) =>
  number()
    .transform((_value: unknown, original: unknown) => typedNumber(original))
    .typeError(typeError);

const optionalCoordinate = (label: string) =>
  decimalNumber(`${label} is a number of metres.`)
    .nullable()
    .transform((value: number | null | undefined) => (value === undefined ? null : value))
    .default(null)
    .defined();

export const headingSchema: ObjectSchema<HeadingInput> = object({
  code: string()
    .trim()
    .required('Give the heading a code, e.g. HR-U.')
    .matches(
      /^[A-Za-z0-9][A-Za-z0-9._-]{0,19}$/,
      'Use up to 20 letters, digits, dots, dashes or underscores.',
    ),
  name: string()
    .trim()
    .required('Give the heading a name (up to 160 characters).')
    .max(160, 'Give the heading a name (up to 160 characters).'),
  startChainage: number()
    .transform((_value: unknown, original: unknown) => {
      if (typeof original === 'number') return original;
      if (typeof original !== 'string' || original.trim() === '') return undefined;
      try {
        return parseChainage(original);
      } catch {
        return Number.NaN;
      }
    })
    .typeError('Write the chainage as kilometres + metres (1+250.0) or in metres (1250.0).')
    .required('Give the start chainage, e.g. 1+250.0.')
    .min(-99999, 'Start chainage is −99 999 to 999 999 m.')
    .max(999999, 'Start chainage is −99 999 to 999 999 m.')
    .test(
      'decimals',
      'Use at most three decimals (millimetres).',
      (v) => Math.abs(v * 1000 - Math.round(v * 1000)) < 1e-6,
    ),
  chainageStyle: mixed<ChainageStyle>().oneOf(['km+m', 'metres']).required(),
  chainageDecimals: number()
    .transform((_value: unknown, original: unknown) => typedNumber(original))
    .required()
    .integer()
    .min(0)
    .max(3),
  driveTrend: decimalNumber('Drive direction is an azimuth in degrees, 0 to less than 360.')
    .required('Give the drive direction in degrees from north.')
    .min(0, 'Drive direction is an azimuth in degrees, 0 to less than 360.')
    .max(359.99, 'Drive direction is an azimuth in degrees, 0 to less than 360.'),
  gradientUnit: mixed<GradientUnit>().oneOf(['percent', 'degrees']).required(),
  gradient: decimalNumber('The gradient is a number; rising is positive, falling negative.')
    .required('Give the gradient (0 for level).')
    .when('gradientUnit', ([unit]: GradientUnit[], schema) =>
      unit === 'degrees'
        ? schema
            .min(
              -MAX_GRADIENT_DEGREES,
              'Gradients steeper than 30 % (16.7°) are outside what Roundbook handles.',
            )
            .max(
              MAX_GRADIENT_DEGREES,
              'Gradients steeper than 30 % (16.7°) are outside what Roundbook handles.',
            )
        : schema
            .min(-MAX_GRADIENT_PERCENT, 'Gradients steeper than 30 % are outside what Roundbook handles.')
            .max(MAX_GRADIENT_PERCENT, 'Gradients steeper than 30 % are outside what Roundbook handles.'),
    ),
  profileShape: mixed<ProfileShape>()
    .oneOf(PROFILE_SHAPES, 'Choose the shape of the profile.')
    .required('Choose the shape of the profile.'),
  profileWidth: decimalNumber('Width is 1 to 40 m.')
    .required('Give the width in metres.')
    .min(1, 'Width is 1 to 40 m.')
    .max(40, 'Width is 1 to 40 m.'),
  profileHeight: decimalNumber('Height is 1 to 40 m.')
    .required('Give the height in metres.')
    .min(1, 'Height is 1 to 40 m.')
    .max(40, 'Height is 1 to 40 m.')
    .test('circular', 'A circular profile has equal width and height.', function check(height) {
      const { profileShape, profileWidth } = this.parent as { profileShape?: string; profileWidth?: unknown };
      const width = typedNumber(profileWidth);
      return (
        profileShape !== 'circular' ||
        width === undefined ||
        Number.isNaN(width) ||
        Math.abs(width - height) <= 0.005
      );
    }),
  axisHeight: decimalNumber('The axis height is a number of metres above the invert.')
    .required('Give the height of the axis above the invert.')
    .min(0, 'The axis lies between the invert and the crown.')
    .test('within', function check(axis) {
      const height = typedNumber((this.parent as { profileHeight?: unknown }).profileHeight);
      if (height === undefined || Number.isNaN(height) || axis <= height) return true;
      return this.createError({ message: `The axis (${axis} m) must lie within the height (${height} m).` });
    }),
  stages: array(mixed<ExcavationStage>().oneOf(STAGES).required())
    .required()
    .min(1, 'Choose at least one stage.'),
  plannedRoundLength: decimalNumber('Planned round length is 0.3 to 8 m.')
    .required('Give the planned round length in metres.')
    .min(0.3, 'Planned round length is 0.3 to 8 m.')
    .max(8, 'Planned round length is 0.3 to 8 m.'),
  startEasting: optionalCoordinate('Easting'),
  startNorthing: optionalCoordinate('Northing'),
  startElevation: optionalCoordinate('Elevation'),
  chainageSense: mixed<ChainageSense>().oneOf(['increasing', 'decreasing']).required(),
  initialBearing: decimalNumber('The initial bearing is an azimuth in degrees, 0 to less than 360.')
    .nullable()
    .transform((value: number | null | undefined) => (value === undefined ? null : value))
    .min(0, 'The initial bearing is an azimuth in degrees, 0 to less than 360.')
    .max(359.99, 'The initial bearing is an azimuth in degrees, 0 to less than 360.')
    .default(null)
    .defined(),
  alignmentSegments: mixed<AlignmentSegmentInput[]>()
    .transform((_value: unknown, original: unknown) => {
      if (Array.isArray(original)) return original as AlignmentSegmentInput[];
      try {
        return parseSegments(typeof original === 'string' ? original : '');
      } catch {
        return undefined;
      }
    })
    .test('segments', function check(value) {
      const text = (this.originalValue as unknown) ?? '';
      if (value !== undefined) return true;
      try {
        parseSegments(typeof text === 'string' ? text : '');
        return true;
      } catch (e) {
        return this.createError({ message: (e as Error).message });
      }
    })
    // Formik sends an empty text as undefined: no segments, one straight.
    .default(() => [])
    .defined(),
  benchHeight: decimalNumber('The bench line is a height in metres above the invert.')
    .nullable()
    .transform((value: number | null | undefined) => (value === undefined ? null : value))
    .min(0.1, 'The bench line lies above the invert.')
    .test('below-crown', function check(bench) {
      const height = typedNumber((this.parent as { profileHeight?: unknown }).profileHeight);
      if (
        bench === null ||
        bench === undefined ||
        height === undefined ||
        Number.isNaN(height) ||
        bench < height
      )
        return true;
      return this.createError({
        message: `The bench line (${bench} m) must lie below the crown (${height} m).`,
      });
    })
    .default(null)
    .defined(),
});

/** The checked form as the API's request body (gradient always in per cent). */
export function toHeadingRequest(values: HeadingFormValues): CreateHeadingRequest {
  const { gradient, gradientUnit, ...rest } = headingSchema.validateSync(values, { stripUnknown: true });
  return {
    ...rest,
    gradientPercent: gradientUnit === 'degrees' ? gradientDegreesToPercent(gradient) : gradient,
  };
}

/** Shows a number with at most `places` decimals and no trailing zeros. */
export function trimmed(n: number, places = 3): string {
  return String(Number(n.toFixed(places)));
}

/** Converts the typed gradient to the other unit (for the toggle); leaves unreadable text alone. */
export function convertGradient(text: string, to: GradientUnit): string {
  const value = typedNumber(text);
  if (value === undefined || Number.isNaN(value)) return text;
  if (to === 'degrees') return trimmed(gradientPercentToDegrees(value));
  if (Math.abs(value) >= 90) return text;
  return trimmed(gradientDegreesToPercent(value));
}

export const emptyHeadingValues: HeadingFormValues = {
  code: '',
  name: '',
  startChainage: '',
  chainageStyle: 'km+m',
  chainageDecimals: '1',
  driveTrend: '',
  gradient: '0',
  gradientUnit: 'percent',
  profileShape: 'horseshoe',
  profileWidth: '',
  profileHeight: '',
  axisHeight: '',
  stages: ['full-face'],
  plannedRoundLength: '',
  startEasting: '',
  startNorthing: '',
  startElevation: '',
  chainageSense: 'increasing',
  initialBearing: '',
  alignmentSegments: '',
  benchHeight: '',
};

const optional = (n: number | null) => (n === null ? '' : String(n));

/** The start chainage in the heading's own style, with enough decimals to keep its value. */
function chainageText(h: Heading): string {
  const shown = formatChainage(h.startChainage, { style: h.chainageStyle, decimals: h.chainageDecimals });
  if (Math.abs(parseChainage(shown) - h.startChainage) < 1e-9) return shown;
  return formatChainage(h.startChainage, { style: h.chainageStyle, decimals: 3 });
}

export function headingToFormValues(h: Heading): HeadingFormValues {
  return {
    code: h.code,
    name: h.name,
    startChainage: chainageText(h),
    chainageStyle: h.chainageStyle,
    chainageDecimals: String(h.chainageDecimals),
    driveTrend: String(h.driveTrend),
    gradient: String(h.gradientPercent),
    gradientUnit: 'percent',
    profileShape: h.profileShape,
    profileWidth: String(h.profileWidth),
    profileHeight: String(h.profileHeight),
    axisHeight: String(h.axisHeight),
    stages: [...h.stages],
    plannedRoundLength: String(h.plannedRoundLength),
    startEasting: optional(h.startEasting),
    startNorthing: optional(h.startNorthing),
    startElevation: optional(h.startElevation),
    chainageSense: h.chainageSense ?? 'increasing',
    initialBearing: optional(h.initialBearing ?? null),
    alignmentSegments: segmentsText(h.alignmentSegments),
    benchHeight: optional(h.benchHeight ?? null),
  };
}

export const headingFieldLabels: Partial<Record<keyof HeadingFormValues, string>> = {
  code: 'Code',
  name: 'Name',
  startChainage: 'Start chainage',
  chainageStyle: 'Chainage shown as',
  chainageDecimals: 'Decimals',
  driveTrend: 'Drive direction',
  gradient: 'Gradient',
  gradientUnit: 'Gradient unit',
  profileShape: 'Shape',
  profileWidth: 'Width',
  profileHeight: 'Height',
  axisHeight: 'Axis above invert',
  stages: 'Stages',
  plannedRoundLength: 'Planned round length',
  startEasting: 'Easting',
  startNorthing: 'Northing',
  startElevation: 'Elevation',
  chainageSense: 'Chainage sense',
  initialBearing: 'Initial bearing',
  alignmentSegments: 'Alignment segments',
  benchHeight: 'Bench line',
};
