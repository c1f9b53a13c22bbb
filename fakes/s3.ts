import fs from 'node:fs';
import S3rver from 's3rver';

/** A local S3-compatible server on loopback, for development and tests only. Real S3 settings skip it. */
export async function startFakeS3(options: { port: number; directory: string; bucket: string }) {
  fs.mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({
    address: '127.0.0.1',
    port: options.port,
    directory: options.directory,
    silent: true,
    configureBuckets: [{ name: options.bucket, configs: [] }],
  });
  const { port } = await server.run();
  return {
    endpoint: `http://127.0.0.1:${port}`,
    close: () => server.close(),
  };
}
