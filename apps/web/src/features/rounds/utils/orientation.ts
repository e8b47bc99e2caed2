import { formatAzimuth, formatDipDirectionDip } from '@roundbook/domain';
import { formatPlane, OrientationError, parsePlane, poleOf, rightHandStrike } from '@roundbook/geomath';
import type { Plane } from '@roundbook/geomath';
import type { PlaneNotation } from '@/features/rounds/api/types';

export type OrientationReading =
  | { kind: 'empty' }
  | {
      kind: 'plane';
      plane: Plane;
      /** "130/50" as dip direction/dip. */
      dipDirectionDip: string;
      /** Right-hand-rule strike, three digits. */
      strike: string;
      /** The pole as trend/plunge. */
      pole: string;
    }
  | { kind: 'error'; message: string };

/** Reads typed orientation text with geomath; the message of an OrientationError is meant to be shown as is. */
export function readOrientation(text: string, notation: PlaneNotation): OrientationReading {
  if (text.trim() === '') return { kind: 'empty' };
  try {
    const plane = parsePlane(text, { notation });
    const pole = poleOf(plane);
    return {
      kind: 'plane',
      plane,
      dipDirectionDip: formatPlane(plane, 'dip-direction/dip'),
      strike: formatAzimuth(rightHandStrike(plane)),
      pole: formatDipDirectionDip({ dipDirection: pole.trend, dip: pole.plunge }),
    };
  } catch (error) {
    if (error instanceof OrientationError) return { kind: 'error', message: error.message };
    return { kind: 'error', message: 'This orientation could not be read.' };
  }
}
