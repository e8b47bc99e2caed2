import { isApiError } from '@/lib/api-client';

export const NEEDS_CONFIRMATION_CODE = 'NEEDS_CONFIRMATION';

/** The 409 NEEDS_CONFIRMATION of a heading change: the server's sentence, how many rounds, which fields. */
export interface RecomputeQuestion {
  message: string;
  rounds: number | null;
  fields: string[];
}

/** The API's names of the fields whose change reworks the rounds, in the form's words. */
const fieldWords: Record<string, string> = {
  driveTrend: 'drive direction',
  gradientPercent: 'gradient',
  profileShape: 'profile shape',
  profileWidth: 'profile width',
  profileHeight: 'profile height',
  axisHeight: 'axis height',
  chainageSense: 'chainage sense',
  initialBearing: 'start bearing',
  alignmentSegments: 'alignment',
  benchHeight: 'bench line',
};

export function recomputeQuestionOf(error: unknown): RecomputeQuestion | null {
  if (!isApiError(error) || error.code !== NEEDS_CONFIRMATION_CODE) return null;
  const rounds = error.details?.rounds;
  const fields = error.details?.fields;
  return {
    message: error.message,
    rounds: typeof rounds === 'number' ? rounds : null,
    fields: Array.isArray(fields) ? fields.filter((f): f is string => typeof f === 'string') : [],
  };
}

/** "drive direction and gradient", from the API's field names. */
export function changedFieldsText(fields: string[]): string {
  const words = fields.map((f) => fieldWords[f] ?? f);
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}
