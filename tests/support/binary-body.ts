import type { Test } from 'supertest';

/** Makes supertest hand back a response's raw bytes (a downloaded file) as a Buffer body. */
export function asBytes(req: Test): Test {
  return req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}
