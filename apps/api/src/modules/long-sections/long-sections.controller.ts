import { Controller, Get, Inject, Param, ParseUUIDPipe } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { LongSectionDto } from './dto/long-section.dto.js';
import { LongSectionsService } from './long-sections.service.js';

@ApiTags('long-sections')
@ApiBearerAuth()
@Controller('projects/:projectId/headings/:headingId/long-section')
export class LongSectionsController {
  constructor(@Inject(LongSectionsService) private readonly longSections: LongSectionsService) {}

  /** The heading's long section: each round's ground along chainage, hazards, and the traces of faults and shear zones with the coming round that reaches them (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: LongSectionDto })
  get(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<LongSectionDto> {
    return this.longSections.get(access, headingId);
  }
}
