import type { Readable } from 'node:stream';
import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CreateMultipartUploadCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  S3Client,
  S3ServiceException,
  UploadPartCommand,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { Inject, Injectable, type OnModuleDestroy } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import {
  StorageNotFoundError,
  StorageService,
  StorageUnavailableError,
  type StoredObject,
  type UploadedPart,
} from './storage.service.js';

/** S3-compatible storage. WHEN_REQUIRED checksums: with the default, s3rver silently corrupts streams. */
@Injectable()
export class S3StorageService extends StorageService implements OnModuleDestroy {
  private readonly client: S3Client;
  private readonly bucket: string;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    super();
    const s = config.storage;
    this.bucket = s.bucket;
    this.client = new S3Client({
      region: s.region,
      endpoint: s.endpoint,
      forcePathStyle: s.forcePathStyle,
      credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey },
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      maxAttempts: 2,
    });
  }

  async put(key: string, body: Buffer | Readable, contentType: string): Promise<void> {
    await this.call(key, () =>
      new Upload({
        client: this.client,
        params: { Bucket: this.bucket, Key: key, Body: body, ContentType: contentType },
      }).done(),
    );
  }

  async get(key: string): Promise<StoredObject> {
    const out = await this.call(key, () =>
      this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key })),
    );
    return { body: out.Body as Readable, contentType: out.ContentType, contentLength: out.ContentLength };
  }

  async delete(key: string): Promise<void> {
    await this.call(key, () => this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key })));
  }

  async check(): Promise<string> {
    await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }), {
      abortSignal: AbortSignal.timeout(3000),
    });
    return `bucket ${this.bucket} reachable`;
  }

  async head(key: string, length: number): Promise<Buffer> {
    const out = await this.call(key, () =>
      this.client.send(
        new GetObjectCommand({ Bucket: this.bucket, Key: key, Range: `bytes=0-${length - 1}` }),
      ),
    );
    const bytes = await out.Body!.transformToByteArray();
    // A server that ignores Range sends the whole object: keep only what was asked for.
    return Buffer.from(bytes.subarray(0, length));
  }

  async stat(key: string): Promise<{ size: number; contentType?: string }> {
    const out = await this.call(key, () =>
      this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: key })),
    );
    return { size: out.ContentLength ?? 0, contentType: out.ContentType };
  }

  async createMultipart(key: string, contentType: string): Promise<string> {
    const out = await this.call(key, () =>
      this.client.send(
        new CreateMultipartUploadCommand({ Bucket: this.bucket, Key: key, ContentType: contentType }),
      ),
    );
    return out.UploadId!;
  }

  async uploadPart(
    key: string,
    uploadId: string,
    partNumber: number,
    body: Readable,
    length: number,
  ): Promise<UploadedPart> {
    const out = await this.call(key, () =>
      this.client.send(
        new UploadPartCommand({
          Bucket: this.bucket,
          Key: key,
          UploadId: uploadId,
          PartNumber: partNumber,
          Body: body,
          ContentLength: length,
        }),
      ),
    );
    return { partNumber, etag: out.ETag ?? '' };
  }

  async completeMultipart(key: string, uploadId: string, parts: UploadedPart[]): Promise<void> {
    await this.call(key, () =>
      this.client.send(
        new CompleteMultipartUploadCommand({
          Bucket: this.bucket,
          Key: key,
          UploadId: uploadId,
          MultipartUpload: {
            Parts: [...parts]
              .sort((a, b) => a.partNumber - b.partNumber)
              .map((p) => ({ PartNumber: p.partNumber, ETag: p.etag })),
          },
        }),
      ),
    );
  }

  async abortMultipart(key: string, uploadId: string): Promise<void> {
    await this.call(key, () =>
      this.client.send(
        new AbortMultipartUploadCommand({ Bucket: this.bucket, Key: key, UploadId: uploadId }),
      ),
    );
  }

  signedGetUrl(key: string, expiresInSeconds: number, downloadName?: string): Promise<string> {
    return getSignedUrl(
      this.client,
      new GetObjectCommand({
        Bucket: this.bucket,
        Key: key,
        ResponseContentDisposition: downloadName ? `inline; filename="${downloadName}"` : undefined,
      }),
      { expiresIn: expiresInSeconds },
    );
  }

  onModuleDestroy(): void {
    this.client.destroy();
  }

  /** Runs one S3 call; a missing object becomes StorageNotFoundError, an unreachable service StorageUnavailableError. */
  private async call<T>(key: string, run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (e) {
      if (e instanceof S3ServiceException) {
        const status = e.$metadata?.httpStatusCode ?? 0;
        if (status === 404 || e.name === 'NoSuchKey' || e.name === 'NoSuchUpload' || e.name === 'NotFound')
          throw new StorageNotFoundError(key);
        if (status >= 500 || status === 0) throw new StorageUnavailableError(e);
        throw e;
      }
      // Network errors (ECONNREFUSED, timeouts, resets) carry no HTTP status.
      throw new StorageUnavailableError(e);
    }
  }
}
