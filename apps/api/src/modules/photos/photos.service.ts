import { randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import { Inject, Injectable, UnsupportedMediaTypeException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { RoundStatus } from '@roundbook/domain';
import { DataSource } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { JobsService } from '../../infrastructure/jobs/jobs.service.js';
import {
  StorageNotFoundError,
  StorageService,
  StorageUnavailableError,
} from '../../infrastructure/storage/storage.service.js';
import { AuditService } from '../audit/audit.service.js';
import { assertEditable } from '../rounds/round-status.js';
import type {
  CompletePhotoUploadDto,
  CreatePhotoUploadDto,
  PhotoDto,
  PhotoUploadDto,
  PhotoUrlDto,
  PhotoScaleDto,
  PhotoVariant,
  UpdatePhotoDto,
  UploadedPartResultDto,
} from './dto/photo.dto.js';
import { Photo, PHOTO_TYPES } from './photo.entity.js';

export const PHOTO_VARIANTS_JOB = 'photo.variants';
export const PHOTO_ABANDON_JOB = 'photo.abandon-upload';
/** An upload not completed within this time is aborted and its parts removed by a job. */
export const UPLOAD_TTL_MS = 24 * 3600_000;
/** Signed download addresses live this long. */
export const URL_TTL_SECONDS = 300;
/** file-type reads at most this many bytes to tell a type (its own sample size). */
const SNIFF_BYTES = 4100;

const ACCEPTED: readonly string[] = [...PHOTO_TYPES, 'image/heif'];
const typeNames = 'JPEG, PNG, WebP or HEIC';

export const mb = (bytes: number): string => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/** The storage outage as the caller sees it: 503 (Retry-After is set by the photos interceptor). */
export function storageDown(): DomainException {
  return new DomainException(
    ErrorCode.ServiceUnavailable,
    'Photo storage cannot be reached right now. Nothing was changed; try again in a minute.',
  );
}

@Injectable()
export class PhotosService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(StorageService) private readonly storage: StorageService,
    @Inject(JobsService) private readonly jobs: JobsService,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async list(access: ProjectAccess, roundId: string): Promise<PhotoDto[]> {
    await this.round(access, roundId);
    const photos = await this.dataSource.getRepository(Photo).find({
      where: { projectId: access.projectId, roundId, uploadState: 'stored' },
      order: { createdAt: 'ASC', id: 'ASC' },
    });
    return this.toDtos(photos);
  }

  async get(access: ProjectAccess, roundId: string, photoId: string): Promise<PhotoDto> {
    await this.round(access, roundId);
    return (await this.toDtos([await this.photo(access, roundId, photoId, 'stored')]))[0];
  }

  async createUpload(
    access: ProjectAccess,
    user: AuthUser,
    roundId: string,
    dto: CreatePhotoUploadDto,
  ): Promise<PhotoUploadDto> {
    assertEditable(await this.round(access, roundId));
    const { maxBytes, partBytes } = this.config.photos;
    if (dto.size > maxBytes)
      throw new DomainException(
        ErrorCode.PayloadTooLarge,
        `This file is ${mb(dto.size)}; a photo can be at most ${mb(maxBytes)}.`,
      );
    const declared = dto.contentType.toLowerCase();
    if (declared !== '' && declared !== 'application/octet-stream' && !ACCEPTED.includes(declared))
      throw new UnsupportedMediaTypeException(
        `Only ${typeNames} photos can be added; this file is ${declared}.`,
      );
    const id = randomUUID();
    // The key is made here from ids only; the device's file name is kept as a label.
    const objectKey = `projects/${access.projectId}/rounds/${roundId}/photos/${id}/original`;
    const uploadId = await this.guard(() =>
      this.storage.createMultipart(
        objectKey,
        ACCEPTED.includes(declared) ? declared : 'application/octet-stream',
      ),
    );
    const photo = await this.dataSource.transaction(async (manager) => {
      const row = manager.create(Photo, {
        id,
        projectId: access.projectId,
        roundId,
        objectKey,
        uploadId,
        uploadState: 'uploading',
        contentType: declared || 'application/octet-stream',
        size: dto.size,
        partSize: partBytes,
        originalName: Array.from(dto.fileName)
          .filter((c) => c.charCodeAt(0) >= 32)
          .join('')
          .slice(0, 255),
        caption: '',
        facePart: null,
        takenAt: null,
        uploadedBy: user.id,
        pinX: null,
        pinY: null,
        scaleAx: null,
        scaleAy: null,
        scaleBx: null,
        scaleBy: null,
        scaleM: null,
        variantState: 'pending',
        thumbnailKey: null,
        displayKey: null,
        width: null,
        height: null,
      });
      await manager.save(row);
      await this.jobs.enqueue(manager, {
        kind: PHOTO_ABANDON_JOB,
        payload: { photoId: id },
        dedupeKey: `photo-abandon:${id}`,
        runAt: new Date(Date.now() + UPLOAD_TTL_MS),
      });
      return row;
    });
    return {
      photo: (await this.toDtos([photo]))[0],
      partSize: partBytes,
      partCount: Math.max(1, Math.ceil(dto.size / partBytes)),
      maxBytes,
    };
  }

  /** Streams one part from the request into the multipart upload; the API holds at most a socket buffer. */
  async uploadPart(
    access: ProjectAccess,
    roundId: string,
    photoId: string,
    partNumber: number,
    contentLength: number,
    body: Readable,
  ): Promise<UploadedPartResultDto> {
    assertEditable(await this.round(access, roundId));
    const photo = await this.photo(access, roundId, photoId, 'uploading');
    const count = Math.max(1, Math.ceil(photo.size / photo.partSize));
    if (!Number.isInteger(partNumber) || partNumber < 1 || partNumber > count)
      throw new DomainException(ErrorCode.ValidationFailed, `This upload has parts 1 to ${count}.`);
    const expected = partNumber < count ? photo.partSize : photo.size - (count - 1) * photo.partSize;
    if (contentLength > expected)
      throw new DomainException(
        ErrorCode.PayloadTooLarge,
        `Part ${partNumber} must be ${expected} bytes; ${contentLength} were sent.`,
      );
    if (contentLength !== expected)
      throw new DomainException(
        ErrorCode.ValidationFailed,
        `Part ${partNumber} must be ${expected} bytes; ${contentLength} were sent.`,
      );
    return this.guard(() =>
      this.storage.uploadPart(photo.objectKey, photo.uploadId!, partNumber, body, expected),
    );
  }

  /**
   * Puts the parts together, then reads the stored object's first bytes: anything but a photo of an
   * accepted type (or a size over the limit) is deleted with its row and refused.
   */
  async complete(
    access: ProjectAccess,
    user: AuthUser,
    roundId: string,
    photoId: string,
    dto: CompletePhotoUploadDto,
  ): Promise<PhotoDto> {
    assertEditable(await this.round(access, roundId));
    const photo = await this.photo(access, roundId, photoId, 'uploading');
    if (photo.uploadId) {
      await this.guard(() => this.storage.completeMultipart(photo.objectKey, photo.uploadId!, dto.parts));
      // The parts are one object now: a retry after a later failure goes straight to the checks.
      photo.uploadId = null;
      await this.dataSource.getRepository(Photo).update({ id: photo.id }, { uploadId: null });
    }
    const { size } = await this.guard(() => this.storage.stat(photo.objectKey));
    if (size > this.config.photos.maxBytes || size !== photo.size) {
      await this.discard(photo);
      throw size > this.config.photos.maxBytes
        ? new DomainException(
            ErrorCode.PayloadTooLarge,
            `This file is ${mb(size)}; a photo can be at most ${mb(this.config.photos.maxBytes)}.`,
          )
        : new DomainException(
            ErrorCode.ValidationFailed,
            `The upload arrived with ${size} bytes instead of ${photo.size}; add the photo again.`,
          );
    }
    const head = await this.guard(() => this.storage.head(photo.objectKey, SNIFF_BYTES));
    const { fileTypeFromBuffer } = await import('file-type');
    const found = await fileTypeFromBuffer(head);
    if (!found || !ACCEPTED.includes(found.mime)) {
      await this.discard(photo);
      throw new UnsupportedMediaTypeException(
        `This file is not a ${typeNames} photo${found ? ` (its contents are ${found.mime})` : ''}; it was not added.`,
      );
    }
    await this.dataSource.transaction(async (manager) => {
      photo.uploadState = 'stored';
      photo.uploadId = null;
      photo.size = size;
      photo.contentType = found.mime === 'image/heif' ? 'image/heic' : found.mime;
      await manager.save(photo);
      await this.jobs.enqueue(manager, {
        kind: PHOTO_VARIANTS_JOB,
        payload: { photoId: photo.id },
        dedupeKey: `photo-variants:${photo.id}`,
      });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: user.id,
        entityType: 'photo',
        entityId: photo.id,
        action: 'photo.added',
        after: { roundId, originalName: photo.originalName, contentType: photo.contentType, size },
      });
    });
    return (await this.toDtos([photo]))[0];
  }

  /** Gives up an upload: its parts are removed from storage and the row deleted. */
  async abortUpload(access: ProjectAccess, roundId: string, photoId: string): Promise<void> {
    await this.round(access, roundId);
    const photo = await this.photo(access, roundId, photoId, 'uploading');
    await this.discard(photo);
  }

  async update(
    access: ProjectAccess,
    user: AuthUser,
    roundId: string,
    photoId: string,
    dto: UpdatePhotoDto,
  ): Promise<PhotoDto> {
    assertEditable(await this.round(access, roundId));
    const photo = await this.photo(access, roundId, photoId, 'stored');
    const before = {
      caption: photo.caption,
      facePart: photo.facePart,
      pinX: photo.pinX,
      pinY: photo.pinY,
      scale: scaleOf(photo),
    };
    if (dto.caption !== undefined) photo.caption = dto.caption.trim();
    if (dto.facePart !== undefined) photo.facePart = dto.facePart;
    if (dto.pinX !== undefined) photo.pinX = dto.pinX;
    if (dto.pinY !== undefined) photo.pinY = dto.pinY;
    if (dto.scale !== undefined) {
      const s = dto.scale;
      if (s !== null && s.a.x === s.b.x && s.a.y === s.b.y)
        throw new DomainException(
          ErrorCode.ValidationFailed,
          'The two points of a scale must be at different places on the photo.',
          { scale: 'Mark two different points.' },
        );
      photo.scaleAx = s?.a.x ?? null;
      photo.scaleAy = s?.a.y ?? null;
      photo.scaleBx = s?.b.x ?? null;
      photo.scaleBy = s?.b.y ?? null;
      photo.scaleM = s?.distanceM ?? null;
    }
    if ((photo.pinX === null) !== (photo.pinY === null))
      throw new DomainException(ErrorCode.ValidationFailed, 'A pin needs both x and y (or neither).', {
        pinX: 'Give both x and y.',
      });
    await this.dataSource.transaction(async (manager) => {
      await manager.save(photo);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: user.id,
        entityType: 'photo',
        entityId: photo.id,
        action: 'photo.updated',
        before,
        after: {
          caption: photo.caption,
          facePart: photo.facePart,
          pinX: photo.pinX,
          pinY: photo.pinY,
          scale: scaleOf(photo),
        },
      });
    });
    return (await this.toDtos([photo]))[0];
  }

  /** Removes a photo of an editable round: a soft delete (the objects are kept), recorded in the audit trail. */
  async remove(access: ProjectAccess, user: AuthUser, roundId: string, photoId: string): Promise<void> {
    assertEditable(await this.round(access, roundId));
    const photo = await this.photo(access, roundId, photoId, 'stored');
    await this.dataSource.transaction(async (manager) => {
      await manager.softDelete(Photo, { id: photo.id });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: user.id,
        entityType: 'photo',
        entityId: photo.id,
        action: 'photo.removed',
        before: {
          roundId,
          originalName: photo.originalName,
          caption: photo.caption,
          objectKey: photo.objectKey,
        },
      });
    });
  }

  /** A short-lived signed address of one size; the original stands in while the others are being made. */
  async url(
    access: ProjectAccess,
    roundId: string,
    photoId: string,
    variant: PhotoVariant,
  ): Promise<PhotoUrlDto> {
    await this.round(access, roundId);
    const photo = await this.photo(access, roundId, photoId, 'stored');
    const key =
      variant === 'thumbnail'
        ? photo.thumbnailKey
        : variant === 'display'
          ? photo.displayKey
          : photo.objectKey;
    const served: PhotoVariant = key ? variant : 'original';
    const url = await this.guard(() => this.storage.signedGetUrl(key ?? photo.objectKey, URL_TTL_SECONDS));
    return { url, variant: served, expiresAt: new Date(Date.now() + URL_TTL_SECONDS * 1000).toISOString() };
  }

  /** Aborts the multipart upload (or deletes the object) and the row: nothing half-written stays referenced. */
  async discard(photo: Photo): Promise<void> {
    try {
      if (photo.uploadId)
        await this.storage.abortMultipart(photo.objectKey, photo.uploadId).catch(ignoreAllButOutage);
      await this.storage.delete(photo.objectKey).catch(ignoreMissing);
    } catch (e) {
      if (e instanceof StorageUnavailableError) throw storageDown();
      throw e;
    }
    await this.dataSource.getRepository(Photo).delete({ id: photo.id });
  }

  private async round(access: ProjectAccess, roundId: string): Promise<RoundStatus> {
    const rows = await this.dataSource.query<Array<{ status: RoundStatus }>>(
      'SELECT status FROM rounds WHERE id = ? AND project_id = ?',
      [roundId, access.projectId],
    );
    if (!rows[0]) throw DomainException.notFound('The round');
    return rows[0].status;
  }

  private async photo(
    access: ProjectAccess,
    roundId: string,
    photoId: string,
    state: Photo['uploadState'],
  ): Promise<Photo> {
    const photo = await this.dataSource
      .getRepository(Photo)
      .findOne({ where: { id: photoId, roundId, projectId: access.projectId } });
    if (!photo) throw DomainException.notFound('The photo');
    if (photo.uploadState !== state)
      throw new DomainException(
        ErrorCode.Conflict,
        state === 'uploading' ? 'This photo has already been stored.' : 'This photo is still being uploaded.',
      );
    return photo;
  }

  private async guard<T>(run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (e) {
      if (e instanceof StorageUnavailableError) throw storageDown();
      if (e instanceof StorageNotFoundError)
        throw new DomainException(
          ErrorCode.Conflict,
          'The upload is no longer in storage; add the photo again.',
        );
      throw e;
    }
  }

  private async toDtos(photos: Photo[]): Promise<PhotoDto[]> {
    const ids = [...new Set(photos.map((p) => p.uploadedBy))];
    const users = ids.length
      ? await this.dataSource.query<Array<{ id: string; name: string }>>(
          `SELECT id, name FROM users WHERE id IN (${ids.map(() => '?').join(', ')})`,
          ids,
        )
      : [];
    const names = new Map(users.map((u) => [u.id, u.name]));
    return photos.map((p) => ({
      id: p.id,
      roundId: p.roundId,
      uploadState: p.uploadState,
      variantState: p.variantState,
      contentType: p.contentType,
      size: p.size,
      originalName: p.originalName,
      caption: p.caption,
      facePart: p.facePart,
      takenAt: p.takenAt ? p.takenAt.toISOString() : null,
      uploadedBy: p.uploadedBy,
      uploadedByName: names.get(p.uploadedBy) ?? null,
      pinX: p.pinX,
      pinY: p.pinY,
      scale: scaleOf(p),
      width: p.width,
      height: p.height,
      createdAt: (p.createdAt ?? new Date()).toISOString(),
    }));
  }
}

/** The stored scale as the API shows it, or null when none is set. */
function scaleOf(p: Photo): PhotoScaleDto | null {
  if (
    p.scaleAx === null ||
    p.scaleAy === null ||
    p.scaleBx === null ||
    p.scaleBy === null ||
    p.scaleM === null
  )
    return null;
  return { a: { x: p.scaleAx, y: p.scaleAy }, b: { x: p.scaleBx, y: p.scaleBy }, distanceM: p.scaleM };
}

/** An upload already gone or completed cannot be aborted; only an outage matters. */
function ignoreAllButOutage(e: unknown): void {
  if (e instanceof StorageUnavailableError) throw e;
}

function ignoreMissing(e: unknown): void {
  if (!(e instanceof StorageNotFoundError)) throw e;
}
