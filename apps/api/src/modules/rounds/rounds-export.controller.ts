import { Controller, Get, Inject, Param, ParseUUIDPipe, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import type { Heading } from '../headings/heading.entity.js';
import { RoundsExport } from './rounds-export.service.js';

/** A file name from the heading's code, never from free text: letters, digits and dashes only. */
const fileName = (heading: Heading, what: string) =>
  `${heading.code.replace(/[^A-Za-z0-9-]+/g, '-') || 'heading'}-${what}.csv`;

@ApiTags('exports')
@ApiBearerAuth()
@Controller('projects/:projectId/headings/:headingId/exports')
export class RoundsExportController {
  constructor(@Inject(RoundsExport) private readonly exports: RoundsExport) {}

  /** Every round of the heading as CSV, one row per round (columns and units in the README; any member) */
  @Get('rounds.csv')
  @ProjectRoles()
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'CSV, UTF-8 with a byte-order mark, CRLF line ends, a header row' })
  async rounds(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<StreamableFile> {
    const heading = await this.exports.heading(access, headingId);
    return new StreamableFile(this.exports.rounds(heading), {
      type: 'text/csv; charset=utf-8',
      disposition: `attachment; filename="${fileName(heading, 'rounds')}"`,
    });
  }

  /** Every joint of the heading's rounds as CSV, one row per joint (columns and units in the README; any member) */
  @Get('joints.csv')
  @ProjectRoles()
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'CSV, UTF-8 with a byte-order mark, CRLF line ends, a header row' })
  async joints(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<StreamableFile> {
    const heading = await this.exports.heading(access, headingId);
    return new StreamableFile(this.exports.joints(heading), {
      type: 'text/csv; charset=utf-8',
      disposition: `attachment; filename="${fileName(heading, 'joints')}"`,
    });
  }
}
