import { Controller, Get, Inject, Param, ParseUUIDPipe, UseInterceptors } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiServiceUnavailableResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { StorageUnavailableInterceptor } from '../photos/storage-unavailable.interceptor.js';
import { SketchRenderDto } from './dto/sketch-render.dto.js';
import { SketchRenders } from './sketch-render.service.js';

@ApiTags('rounds')
@ApiBearerAuth()
@UseInterceptors(StorageUnavailableInterceptor)
@Controller('projects/:projectId/rounds/:roundId/sketch')
export class SketchRenderController {
  constructor(@Inject(SketchRenders) private readonly renders: SketchRenders) {}

  /** Signed addresses (a few minutes) of the PNG and SVG picture of the sketch as last submitted (any member) */
  @Get('render')
  @ProjectRoles()
  @ApiOkResponse({ type: SketchRenderDto })
  @ApiNotFoundResponse({ type: ErrorResponseDto, description: 'No submit of this round had a sketch' })
  @ApiServiceUnavailableResponse({
    type: ErrorResponseDto,
    description: 'Object storage unreachable (Retry-After)',
  })
  render(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<SketchRenderDto> {
    return this.renders.url(access, roundId);
  }
}
