/** Degrees at every public boundary. Branded so that internal radians are not passed by mistake. */
export type Degrees = number & { readonly __unit?: 'deg' };
export type Radians = number & { readonly __unit?: 'rad' };

/** A plane as dip direction / dip (degrees). dipDirection in [0, 360), dip in [0, 90]. */
export interface Plane {
  dipDirection: number;
  dip: number;
}

/** A line as trend / plunge (degrees), lower hemisphere: trend in [0, 360), plunge in [0, 90]. */
export interface Line {
  trend: number;
  plunge: number;
}

/** A tunnel axis in the direction of advance. plunge > 0 descending, < 0 climbing. */
export interface Drive {
  trend: number;
  plunge: number;
}

/** A vector in the north-east-down frame: x = north, y = east, z = down. */
export type Vector3 = readonly [number, number, number];

/** Bad or contradictory orientation input. The message says what is wrong and what was expected. */
export class OrientationError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'OrientationError';
  }
}

/** A rating input outside its published table. */
export class RatingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RatingError';
  }
}
