// Local S3 fake for development and tests: s3rver on 127.0.0.1 with one bucket.
import S3rver from 's3rver';

const port = Number(process.env.S3_FAKE_PORT ?? 4569);
const directory = process.env.S3_FAKE_DIR ?? '.data/s3';
const bucket = process.env.S3_FAKE_BUCKET ?? 'roundbook';

const server = new S3rver({
  address: '127.0.0.1',
  port,
  directory,
  silent: true,
  configureBuckets: [{ name: bucket }],
});
await server.run();
console.log(`S3 fake listening on 127.0.0.1:${port}, bucket ${bucket}`);

const stop = () => server.close().finally(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
