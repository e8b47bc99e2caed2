import {
  Body,
  Controller,
  Delete,
  Get,
  Headers,
  HttpCode,
  Inject,
  Param,
  ParseIntPipe,
  ParseUUIDPipe,
  Patch,
  Post,
  Put,
  Query,
  Req,
  UseInterceptors,
} from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiBody,
  ApiConflictResponse,
  ApiConsumes,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiPayloadTooLargeResponse,
  ApiServiceUnavailableResponse,
  ApiTags,
  ApiUnsupportedMediaTypeResponse,
} from '@nestjs/swagger';
import type { Request } from 'express';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import {
  CompletePhotoUploadDto,
  CreatePhotoUploadDto,
  PhotoDto,
  PhotoUploadDto,
  PhotoUrlDto,
  PhotoUrlQueryDto,
  UpdatePhotoDto,
  UploadedPartResultDto,
} from './dto/photo.dto.js';
import { PhotosService } from './photos.service.js';
import { StorageUnavailableInterceptor } from './storage-unavailable.interceptor.js';

/** Photographs of a round: members read; geologists and admins add, edit and remove while it is editable. */
@ApiTags('photos')
@ApiBearerAuth()
@ApiServiceUnavailableResponse({
  type: ErrorResponseDto,
  description: 'Object storage unreachable (Retry-After)',
})
@UseInterceptors(StorageUnavailableInterceptor)
@Controller('projects/:projectId/rounds/:roundId/photos')
export class PhotosController {
  constructor(@Inject(PhotosService) private readonly photos: PhotosService) {}

  /** The round's stored photos, oldest first (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: [PhotoDto] })
  list(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<PhotoDto[]> {
    return this.photos.list(access, roundId);
  }

  /** Starts an upload: checks the declared size and type, opens a multipart upload in object storage */
  @Post()
  @ProjectRoles('geologist', 'admin')
  @ApiCreatedResponse({ type: PhotoUploadDto })
  @ApiPayloadTooLargeResponse({ type: ErrorResponseDto })
  @ApiUnsupportedMediaTypeResponse({ type: ErrorResponseDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'The round is not editable' })
  create(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentAccess() access: ProjectAccess,
    @CurrentUser() user: AuthUser,
    @Body() dto: CreatePhotoUploadDto,
  ): Promise<PhotoUploadDto> {
    return this.photos.createUpload(access, user, roundId, dto);
  }

  /** One part of the file as the raw request body (application/octet-stream), streamed to storage */
  @Put(':photoId/parts/:partNumber')
  @ProjectRoles('geologist', 'admin')
  @ApiConsumes('application/octet-stream')
  @ApiBody({ schema: { type: 'string', format: 'binary' } })
  @ApiOkResponse({ type: UploadedPartResultDto })
  @ApiPayloadTooLargeResponse({ type: ErrorResponseDto })
  uploadPart(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('photoId', ParseUUIDPipe) photoId: string,
    @Param('partNumber', ParseIntPipe) partNumber: number,
    @Headers('content-length') contentLength: string | undefined,
    @CurrentAccess() access: ProjectAccess,
    @Req() req: Request,
  ): Promise<UploadedPartResultDto> {
    const length = Number(contentLength);
    if (!contentLength || !Number.isInteger(length) || length < 0)
      throw new DomainException(ErrorCode.ValidationFailed, 'Send each part with its Content-Length.');
    return this.photos.uploadPart(access, roundId, photoId, partNumber, length, req);
  }

  /** Puts the parts together and checks the file by its bytes; the thumbnail job is queued */
  @Post(':photoId/complete')
  @HttpCode(200)
  @ProjectRoles('geologist', 'admin')
  @ApiOkResponse({ type: PhotoDto })
  @ApiPayloadTooLargeResponse({ type: ErrorResponseDto })
  @ApiUnsupportedMediaTypeResponse({ type: ErrorResponseDto, description: 'Not a JPEG, PNG, WebP or HEIC' })
  complete(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('photoId', ParseUUIDPipe) photoId: string,
    @CurrentAccess() access: ProjectAccess,
    @CurrentUser() user: AuthUser,
    @Body() dto: CompletePhotoUploadDto,
  ): Promise<PhotoDto> {
    return this.photos.complete(access, user, roundId, photoId, dto);
  }

  /** Gives up an unfinished upload (its parts are removed) */
  @Delete(':photoId/upload')
  @HttpCode(204)
  @ProjectRoles('geologist', 'admin')
  @ApiNoContentResponse()
  abort(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('photoId', ParseUUIDPipe) photoId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<void> {
    return this.photos.abortUpload(access, roundId, photoId);
  }

  /** One stored photo (any member) */
  @Get(':photoId')
  @ProjectRoles()
  @ApiOkResponse({ type: PhotoDto })
  get(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('photoId', ParseUUIDPipe) photoId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<PhotoDto> {
    return this.photos.get(access, roundId, photoId);
  }

  /** Caption, part of the face, pin on the sketch, scale on the photo */
  @Patch(':photoId')
  @ProjectRoles('geologist', 'admin')
  @ApiOkResponse({ type: PhotoDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'The round is not editable' })
  update(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('photoId', ParseUUIDPipe) photoId: string,
    @CurrentAccess() access: ProjectAccess,
    @CurrentUser() user: AuthUser,
    @Body() dto: UpdatePhotoDto,
  ): Promise<PhotoDto> {
    return this.photos.update(access, user, roundId, photoId, dto);
  }

  /** Removes a photo of an editable round (kept in the audit trail) */
  @Delete(':photoId')
  @HttpCode(204)
  @ProjectRoles('geologist', 'admin')
  @ApiNoContentResponse()
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'The round is not editable' })
  remove(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('photoId', ParseUUIDPipe) photoId: string,
    @CurrentAccess() access: ProjectAccess,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    return this.photos.remove(access, user, roundId, photoId);
  }

  /** A signed address, valid a few minutes, of the original, the display size or the thumbnail (any member) */
  @Get(':photoId/url')
  @ProjectRoles()
  @ApiOkResponse({ type: PhotoUrlDto })
  url(
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('photoId', ParseUUIDPipe) photoId: string,
    @CurrentAccess() access: ProjectAccess,
    @Query() query: PhotoUrlQueryDto,
  ): Promise<PhotoUrlDto> {
    return this.photos.url(access, roundId, photoId, query.variant ?? 'original');
  }
}
