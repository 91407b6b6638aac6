// A local S3-compatible server (s3rver) on 127.0.0.1 for development and tests.
// Objects live as files under `directory`; the bucket is created at start.
// Accepts the access key id S3RVER only, and does not verify SigV4 signatures.
import { mkdir } from 'node:fs/promises';
import type { Server } from 'node:http';
import S3rver from 's3rver';

export interface S3FakeOptions {
  /** 0 = any free port. */
  port?: number;
  directory: string;
  bucket: string;
}

export interface S3Fake {
  endpoint: string;
  port: number;
  stop(): Promise<void>;
}

const HOST = '127.0.0.1';

export async function startS3Fake({ port = 0, directory, bucket }: S3FakeOptions): Promise<S3Fake> {
  await mkdir(directory, { recursive: true });
  const server = new S3rver({
    address: HOST,
    port,
    directory,
    silent: true,
    // Path-style URLs only (http://127.0.0.1:port/bucket/key), as S3_FORCE_PATH_STYLE=true sends.
    vhostBuckets: false,
    configureBuckets: [{ name: bucket, configs: [] }],
  });
  const address = await server.run();
  let stopped = false;
  return {
    endpoint: `http://${HOST}:${address.port}`,
    port: address.port,
    async stop() {
      if (stopped) return;
      stopped = true;
      const http = (server as unknown as { httpServer?: Server }).httpServer;
      const closing = server.close();
      // Keep-alive sockets from an SDK client would otherwise hold close() open.
      http?.closeAllConnections();
      await closing;
    },
  };
}
