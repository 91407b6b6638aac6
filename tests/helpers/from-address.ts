// Requests from a chosen loopback source address (127.0.0.2, 127.0.0.3, …: Linux routes the whole
// 127.0.0.0/8 to the loopback interface), so tests can be "two different addresses" without any
// proxy header and without leaving the machine.
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';

export interface Answer {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  /** The parsed JSON (loosely typed, as supertest gives it). */
  body: any;
}

export interface Served {
  /** POSTs JSON from `from` (a 127.x.y.z address) with optional extra headers. */
  post(from: string, path: string, body: unknown, headers?: Record<string, string>): Promise<Answer>;
  stop(): Promise<void>;
}

/** Serves the app on 127.0.0.1 on a free port. */
export async function serveOnLoopback(app: Express): Promise<Served> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const { port } = server.address() as AddressInfo;
  return {
    post: (from, path, body, headers = {}) =>
      new Promise<Answer>((resolve, reject) => {
        const data = Buffer.from(JSON.stringify(body));
        const req = httpRequest(
          { host: '127.0.0.1', port, localAddress: from, method: 'POST', path, agent: false, headers: { 'content-type': 'application/json', 'content-length': String(data.length), ...headers } },
          (res) => {
            const chunks: Buffer[] = [];
            res.on('data', (c: Buffer) => chunks.push(c));
            res.on('end', () => {
              const text = Buffer.concat(chunks).toString('utf8');
              let parsed: unknown = null;
              try {
                parsed = text ? JSON.parse(text) : null;
              } catch {
                parsed = text;
              }
              resolve({ status: res.statusCode ?? 0, headers: res.headers, body: parsed });
            });
          },
        );
        req.on('error', reject);
        req.end(data);
      }),
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
