import { createWriteStream } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { Inject, Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import exifr from 'exifr';
import sharp from 'sharp';
import { DataSource } from 'typeorm';
import { JobHandlers, PermanentJobError } from '../../infrastructure/jobs/job-handlers.js';
import { StorageNotFoundError, StorageService } from '../../infrastructure/storage/storage.service.js';
import { exifTakenAt } from './photo-time.js';
import { Photo } from './photo.entity.js';
import { PHOTO_ABANDON_JOB, PHOTO_VARIANTS_JOB, PhotosService } from './photos.service.js';

/** Longest side of the gallery thumbnail and of the screen-size copy, pixels. */
export const THUMBNAIL_PX = 320;
export const DISPLAY_PX = 1600;

// No operation cache: each photo is read once, and the cache would only keep decoded pixels of photos done.
sharp.cache(false);

/**
 * The display size and the thumbnail from one decode of the original: the display size with the JPEG
 * shrunk while it is decoded (libvips' shrink-on-load, chosen by resize), the EXIF orientation applied;
 * the thumbnail from the display size (already turned upright; no EXIF left in it). Plain libjpeg-turbo
 * encoding: mozjpeg's trellis quantisation and scan optimisation took about 1.1 s of the 1.3 s per 8 MP
 * photo for a display file about 17 % smaller (measured on the benchmark's photos).
 */
export async function makeSizes(
  file: string,
): Promise<{ thumbnail: Buffer; display: Buffer; width: number; height: number }> {
  const display = await sharp(file)
    .rotate()
    .resize(DISPLAY_PX, DISPLAY_PX, { fit: 'inside', withoutEnlargement: true })
    .jpeg({ quality: 85 })
    .toBuffer({ resolveWithObject: true });
  const thumbnail = await sharp(display.data)
    .resize(THUMBNAIL_PX, THUMBNAIL_PX, { fit: 'inside', withoutEnlargement: true })
    .jpeg({ quality: 80 })
    .toBuffer();
  const meta = await sharp(file).metadata();
  // Orientations 5–8 turn the picture a quarter: width and height swap (EXIF 2.32, tag 0x0112).
  const turned = (meta.orientation ?? 1) >= 5;
  return {
    thumbnail,
    display: display.data,
    width: (turned ? meta.height : meta.width) ?? display.info.width,
    height: (turned ? meta.width : meta.height) ?? display.info.height,
  };
}

/**
 * The photos' background work: the thumbnail and display sizes (EXIF orientation applied, time taken read
 * from EXIF), and the clean-up of uploads never completed.
 */
@Injectable()
export class PhotoVariantsJob implements OnModuleInit {
  private readonly logger = new Logger('Photos');

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(StorageService) private readonly storage: StorageService,
    @Inject(JobHandlers) private readonly handlers: JobHandlers,
    @Inject(PhotosService) private readonly photos: PhotosService,
  ) {}

  onModuleInit(): void {
    this.handlers.register(PHOTO_VARIANTS_JOB, (payload) => this.makeVariants(String(payload.photoId)));
    this.handlers.register(PHOTO_ABANDON_JOB, (payload) => this.abandon(String(payload.photoId)));
  }

  /** The decodes of this process, one after the other (see decodeInTurn). */
  private decoding: Promise<unknown> = Promise.resolve();

  /**
   * Runs one photo's decode after those this process has started already: one 8 MP photo in memory at a
   * time. The worker runs up to JOBS_CONCURRENCY jobs at once; four photos decoded side by side held four
   * times the pixels for no gain in time on two cores (issue 14's benchmark).
   */
  private decodeInTurn<T>(run: () => Promise<T>): Promise<T> {
    const turn = this.decoding.then(run);
    this.decoding = turn.catch(() => undefined);
    return turn;
  }

  async makeVariants(photoId: string): Promise<void> {
    const repo = this.dataSource.getRepository(Photo);
    const photo = await repo.findOne({ where: { id: photoId }, withDeleted: true });
    if (!photo || photo.uploadState !== 'stored' || photo.variantState === 'ready') return;
    // The original goes to a temporary file, not into memory (up to 25 MB per photo, several at once).
    const dir = await mkdtemp(path.join(tmpdir(), 'rb-photo-'));
    const file = path.join(dir, 'original');
    try {
      let original;
      try {
        original = await this.storage.get(photo.objectKey);
      } catch (e) {
        if (e instanceof StorageNotFoundError)
          throw new PermanentJobError(`The original of ${photoId} is gone.`);
        throw e;
      }
      await pipeline(original.body, createWriteStream(file));
      let made: { thumbnail: Buffer; display: Buffer; width: number; height: number };
      try {
        made = await this.decodeInTurn(() => makeSizes(file));
      } catch (e) {
        // The bytes passed the type check but cannot be decoded here (say a HEIC codec libvips lacks):
        // the original stays, shown as it is.
        await repo.update({ id: photoId }, { variantState: 'failed' });
        throw new PermanentJobError(
          `Could not make the smaller sizes: ${e instanceof Error ? e.message : String(e)}`,
        );
      }
      const takenAt = photo.takenAt ?? (await this.takenAt(file, photo.projectId));
      const base = photo.objectKey.replace(/\/original$/, '');
      const thumbnailKey = `${base}/thumbnail.jpg`;
      const displayKey = `${base}/display.jpg`;
      await this.storage.put(thumbnailKey, made.thumbnail, 'image/jpeg');
      await this.storage.put(displayKey, made.display, 'image/jpeg');
      await repo.update(
        { id: photoId },
        { thumbnailKey, displayKey, variantState: 'ready', width: made.width, height: made.height, takenAt },
      );
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  }

  /** An upload still open after its time: its parts are aborted and the row removed. */
  async abandon(photoId: string): Promise<void> {
    const photo = await this.dataSource.getRepository(Photo).findOne({ where: { id: photoId } });
    if (!photo || photo.uploadState !== 'uploading') return;
    await this.photos.discard(photo);
    this.logger.log(`Removed the unfinished upload of photo ${photoId}`);
  }

  private async takenAt(file: string, projectId: string): Promise<Date | null> {
    try {
      const exif = (await exifr.parse(file, {
        pick: ['DateTimeOriginal', 'OffsetTimeOriginal'],
        reviveValues: false,
      })) as { DateTimeOriginal?: unknown; OffsetTimeOriginal?: unknown } | undefined;
      if (!exif) return null;
      const rows = await this.dataSource.query<Array<{ time_zone: string }>>(
        'SELECT time_zone FROM projects WHERE id = ?',
        [projectId],
      );
      return exifTakenAt(exif.DateTimeOriginal, exif.OffsetTimeOriginal, rows[0]?.time_zone ?? 'UTC');
    } catch {
      return null;
    }
  }
}
