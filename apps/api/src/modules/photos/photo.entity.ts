import { Column, DeleteDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { CreatedAt, UpdatedAt } from '../../common/dto/timestamps.js';
import { Round } from '../rounds/round.entity.js';

/** Where on the face a photo looks (the parts a face map is described by). */
export const FACE_PARTS = ['face', 'crown', 'left-wall', 'right-wall', 'invert', 'probe'] as const;
export type FacePart = (typeof FACE_PARTS)[number];

/** The original's life: parts arriving, stored and checked, or refused by its bytes. */
export const UPLOAD_STATES = ['uploading', 'stored'] as const;
export type UploadState = (typeof UPLOAD_STATES)[number];

/** The smaller sizes made by the job: waiting, made, or could not be made (the original still shows). */
export const VARIANT_STATES = ['pending', 'ready', 'failed'] as const;
export type VariantState = (typeof VARIANT_STATES)[number];

/** The image types accepted, as read from the file's first bytes. */
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic'] as const;

/** A photograph of a round, its original in object storage under a key made by the API. */
@Entity('photos')
@Index('IDX_photos_round', ['roundId', 'createdAt'])
export class Photo {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  @ManyToOne(() => Round, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'round_id', foreignKeyConstraintName: 'FK_photos_round' })
  round?: Round;

  @Column({ name: 'object_key', type: 'varchar', length: 255 })
  objectKey: string;

  /** The S3 multipart upload while parts are arriving; null once stored. */
  @Column({ name: 'upload_id', type: 'varchar', length: 255, nullable: true })
  uploadId: string | null;

  @Column({ name: 'upload_state', type: 'enum', enum: UPLOAD_STATES, default: 'uploading' })
  uploadState: UploadState;

  /** Declared by the browser, then as read from the bytes on completion. */
  @Column({ name: 'content_type', type: 'varchar', length: 64 })
  contentType: string;

  /** Declared size while uploading, the stored size afterwards (bytes). */
  @Column({ type: 'int' })
  size: number;

  @Column({ name: 'part_size', type: 'int' })
  partSize: number;

  /** The file's name on the uploader's device, for display only (never part of a key). */
  @Column({ name: 'original_name', type: 'varchar', length: 255 })
  originalName: string;

  @Column({ type: 'varchar', length: 500, default: '' })
  caption: string;

  @Column({ name: 'face_part', type: 'enum', enum: FACE_PARTS, nullable: true })
  facePart: FacePart | null;

  @Column({ name: 'taken_at', type: 'datetime', precision: 3, nullable: true })
  takenAt: Date | null;

  @Column({ name: 'uploaded_by', type: 'uuid' })
  uploadedBy: string;

  /** The pin on the face sketch, in metres from the sketch's origin. */
  @Column({ name: 'pin_x', type: 'double', nullable: true })
  pinX: number | null;

  @Column({ name: 'pin_y', type: 'double', nullable: true })
  pinY: number | null;

  /** The scale: two points as fractions (0–1) of the upright width and height, and their distance (m). */
  @Column({ name: 'scale_ax', type: 'double', nullable: true })
  scaleAx: number | null;

  @Column({ name: 'scale_ay', type: 'double', nullable: true })
  scaleAy: number | null;

  @Column({ name: 'scale_bx', type: 'double', nullable: true })
  scaleBx: number | null;

  @Column({ name: 'scale_by', type: 'double', nullable: true })
  scaleBy: number | null;

  @Column({ name: 'scale_m', type: 'double', nullable: true })
  scaleM: number | null;

  @Column({ name: 'variant_state', type: 'enum', enum: VARIANT_STATES, default: 'pending' })
  variantState: VariantState;

  @Column({ name: 'thumbnail_key', type: 'varchar', length: 255, nullable: true })
  thumbnailKey: string | null;

  @Column({ name: 'display_key', type: 'varchar', length: 255, nullable: true })
  displayKey: string | null;

  /** Pixel size after EXIF orientation, once the job has read it. */
  @Column({ type: 'int', nullable: true })
  width: number | null;

  @Column({ type: 'int', nullable: true })
  height: number | null;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  /** Removed from a draft round: kept (and audited), no longer listed. */
  @DeleteDateColumn({ name: 'deleted_at', type: 'datetime', precision: 3, nullable: true })
  deletedAt: Date | null;
}
