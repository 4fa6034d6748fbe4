import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';

interface StoredObject {
  data: Buffer;
  contentType: string | undefined;
}

export interface FakeS3Request {
  method: string;
  path: string;
  headers: IncomingMessage['headers'];
}

export interface FakeS3 {
  /** `http://127.0.0.1:<port>`, to pass as the S3 endpoint with forcePathStyle. */
  endpoint: string;
  /** Every request received, oldest first, so tests can check what the SDK sent. */
  requests(): FakeS3Request[];
  /** What is stored under bucket/key, bypassing the SDK. */
  object(bucket: string, key: string): StoredObject | undefined;
  close(): Promise<void>;
}

/**
 * A few dozen lines of S3 for tests: path-style PUT, GET and DELETE of objects
 * on 127.0.0.1, with the real error XML so the SDK's error mapping runs. It
 * checks that requests are signed but not the signature itself.
 */
export async function startFakeS3(options: { buckets: string[] }): Promise<FakeS3> {
  const buckets = new Map(options.buckets.map((name) => [name, new Map<string, StoredObject>()]));
  const requests: FakeS3Request[] = [];

  const server = createServer((req, res) => {
    handle(req, res).catch((error: unknown) => {
      sendError(res, 500, 'InternalError', error instanceof Error ? error.message : String(error));
    });
  });

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? '/', 'http://fake-s3');
    const method = req.method ?? 'GET';
    requests.push({ method, path: url.pathname, headers: req.headers });
    const body = await readBody(req);

    if (!req.headers.authorization?.startsWith('AWS4-HMAC-SHA256 ')) {
      return sendError(res, 403, 'AccessDenied', 'Request is not signed');
    }
    const [, bucketName = '', ...keyParts] = url.pathname.split('/');
    const key = keyParts.map(decodeURIComponent).join('/');
    const bucket = buckets.get(bucketName);
    if (bucket === undefined) {
      return sendError(res, 404, 'NoSuchBucket', 'The specified bucket does not exist');
    }
    if (key === '') return sendError(res, 501, 'NotImplemented', 'Bucket operations are not faked');

    if (method === 'PUT') {
      const header = req.headers['content-type'];
      bucket.set(key, { data: body, contentType: header });
      res.writeHead(200, { ETag: '"fake"' }).end();
    } else if (method === 'GET') {
      const stored = bucket.get(key);
      if (stored === undefined) {
        return sendError(res, 404, 'NoSuchKey', 'The specified key does not exist.');
      }
      res.writeHead(200, {
        'Content-Length': stored.data.length,
        ...(stored.contentType === undefined ? {} : { 'Content-Type': stored.contentType }),
      });
      res.end(stored.data);
    } else if (method === 'DELETE') {
      bucket.delete(key);
      res.writeHead(204).end();
    } else {
      sendError(res, 405, 'MethodNotAllowed', `${method} is not faked`);
    }
  }

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  const { port } = server.address() as AddressInfo;

  return {
    endpoint: `http://127.0.0.1:${port}`,
    requests: () => [...requests],
    object: (bucket, key) => buckets.get(bucket)?.get(key),
    close: () =>
      new Promise<void>((resolve, reject) => {
        // The SDK keeps sockets alive; without this close() would wait for them.
        server.closeAllConnections();
        server.close((error) => (error ? reject(error) : resolve()));
      }),
  };
}

async function readBody(req: IncomingMessage): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

function sendError(res: ServerResponse, status: number, code: string, message: string): void {
  const xml = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${code}</Code><Message>${message}</Message><RequestId>fake</RequestId></Error>`;
  res.writeHead(status, { 'Content-Type': 'application/xml' }).end(xml);
}
