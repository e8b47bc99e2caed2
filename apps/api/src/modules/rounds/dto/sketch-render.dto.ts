import { ApiProperty } from '@nestjs/swagger';

export const SKETCH_RENDER_STATES = ['ready', 'rendering'] as const;
export type SketchRenderState = (typeof SKETCH_RENDER_STATES)[number];

/** The picture of a round's sketch as last submitted: short-lived signed addresses of its PNG and SVG. */
export class SketchRenderDto {
  /** The revision whose sketch the picture shows (the last submit) */
  revision: number;
  /** 'rendering' while the job has not written the picture yet (ask again shortly) */
  @ApiProperty({ enum: SKETCH_RENDER_STATES, enumName: 'SketchRenderState' })
  state: SketchRenderState;
  @ApiProperty({ type: String, nullable: true })
  pngUrl: string | null;
  @ApiProperty({ type: String, nullable: true })
  svgUrl: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true })
  expiresAt: string | null;
}
