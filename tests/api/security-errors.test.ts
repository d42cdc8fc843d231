// Every error a client sees is ours: a code of our own and our own words, whatever library failed underneath (the
// body parser's decompression, the payment provider's signature check). The library's text goes to the log only.
// Yardstick: OWASP ASVS 5.0 V16.5.1 (a generic message to the client, details only in the log), number from memory.
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestApp } from './harness';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

// Phrases of the libraries underneath (zlib, body-parser, raw-body, the Stripe SDK), from their sources.
const LIBRARY_TEXT = /incorrect header check|unexpected end of file|zlib|unsupported content encoding|unsupported charset|No signatures found|Unable to extract timestamp|expected signature|raw request body/;

function expectOurs(res: request.Response, status: number, error: string) {
  expect(res.status).toBe(status);
  expect(res.body.error).toBe(error);
  expect(res.body.message).toEqual(expect.any(String));
  expect(JSON.stringify(res.body)).not.toMatch(LIBRARY_TEXT);
}

describe('request bodies the parser cannot read', () => {
  it('answers a damaged compressed body with our code, naming the body', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send(Buffer.from('not gzip at all'));
    expectOurs(res, 400, 'malformed_body');
    expect(res.body.details).toEqual([{ field: 'body', rule: 'must be readable as sent' }]);
  });

  it('answers a truncated compressed body the same way', async () => {
    const whole = gzipSync(JSON.stringify({ email: 'agent@bumpboard.test', password: 'x'.repeat(500) }));
    const res = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send(whole.subarray(0, whole.length / 2));
    expectOurs(res, 400, 'malformed_body');
  });

  it('answers an unknown compression with 415 and our code', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').set('Content-Encoding', 'x-squeezed').send('{}');
    expectOurs(res, 415, 'unsupported_encoding');
  });

  it('answers an unknown character set with 415 and our code', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json; charset=x-unknown').send('{}');
    expectOurs(res, 415, 'unsupported_charset');
  });
});

describe('the payment provider’s webhook', () => {
  it.each([
    ['no signature', undefined],
    ['a malformed signature', 'garbage'],
    ['a wrong signature', `t=${Math.floor(Date.now() / 1000)},v1=${'0'.repeat(64)}`],
  ])('answers %s in our words, naming the header', async (_name, signature) => {
    const req = request(t.app).post('/api/payments/webhook').set('Content-Type', 'application/json');
    if (signature) req.set('Stripe-Signature', signature);
    const res = await req.send(JSON.stringify({ id: 'evt_test', type: 'charge.succeeded' }));
    expectOurs(res, 400, 'invalid_request');
    expect(res.body.details).toEqual([{ field: 'Stripe-Signature', rule: 'must be a valid signature of this body, made within the last 300 seconds' }]);
  });
});
