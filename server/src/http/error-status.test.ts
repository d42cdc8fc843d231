// Each domain failure kind answered with the status the API gave for it before the domain stopped knowing about HTTP.
// Yardstick: RFC 9110 §15.5 (400, 401, 403, 404, 409, 410, 422, 429 meanings) and RFC 4918 §11.3 (423 Locked),
// RFC 9110 §15.6.3 (502 Bad Gateway), RFC 6585 §4 (429 Too Many Requests) and RFC 9110 §10.2.3 (Retry-After in
// seconds); section numbers from memory.
import { describe, expect, it } from 'vitest';
import { badRequest, conflict, DomainError, forbidden, gone, locked, notFound, retryLater, tooManyRequests, unauthenticated, unprocessable, upstreamFailed } from '../domain/errors';
import { errorResponse, STATUS_OF_KIND } from './error-status';

describe('kind → status', () => {
  it('covers every kind with the status worked out by hand', () => {
    expect(STATUS_OF_KIND).toEqual({
      invalid: 400, unauthenticated: 401, not_allowed: 403, not_found: 404, conflict: 409,
      gone: 410, unprocessable: 422, locked: 423, rate_limited: 429, upstream_failed: 502,
    });
  });

  it.each([
    [badRequest('pnr: must be 6 letters or digits', [{ field: 'pnr', rule: 'must be 6 letters or digits' }]), 400, { error: 'invalid_request', message: 'pnr: must be 6 letters or digits', details: [{ field: 'pnr', rule: 'must be 6 letters or digits' }] }],
    [unauthenticated(), 401, { error: 'not_signed_in', message: 'Sign in to continue.' }],
    [unauthenticated('invalid_api_key', 'Send a valid key.'), 401, { error: 'invalid_api_key', message: 'Send a valid key.' }],
    [forbidden(), 403, { error: 'forbidden', message: 'Your role may not do this.' }],
    [forbidden('These booking details do not match this link. 2 tries left.', 'booking_not_matched'), 403, { error: 'booking_not_matched', message: 'These booking details do not match this link. 2 tries left.' }],
    [notFound('Flight'), 404, { error: 'not_found', message: 'Flight was not found.' }],
    [new DomainError('not_found', 'link_invalid', 'This link does not work.'), 404, { error: 'link_invalid', message: 'This link does not work.' }],
    [conflict('round_full', 'The round is full.'), 409, { error: 'round_full', message: 'The round is full.' }],
    [gone('link_used', 'This link has already been used.'), 410, { error: 'link_used', message: 'This link has already been used.' }],
    [unprocessable('event_rejected', 'flight: is not known', [{ field: 'flight', rule: 'is not known' }]), 422, { error: 'event_rejected', message: 'flight: is not known', details: [{ field: 'flight', rule: 'is not known' }] }],
    [locked('link_locked', 'This link is locked.'), 423, { error: 'link_locked', message: 'This link is locked.' }],
    [tooManyRequests('Too many attempts on this link.'), 429, { error: 'too_many_attempts', message: 'Too many attempts on this link.' }],
    [upstreamFailed('We could not reach the bank just now.'), 502, { error: 'provider_unavailable', message: 'We could not reach the bank just now.' }],
  ])('%s → its status and body, no Retry-After', (err, status, body) => {
    expect(errorResponse(err)).toEqual({ status, headers: {}, body });
  });

  it('says how long to wait in a Retry-After header (whole seconds) and in words', () => {
    expect(errorResponse(retryLater(90))).toEqual({
      status: 429,
      headers: { 'Retry-After': '90' },
      body: { error: 'too_many_attempts', message: 'Too many failed sign-ins from here. Wait 90 seconds and try again, or ask an admin to reset your password.' },
    });
    // Under a second still waits one; past two minutes the words round up to whole minutes (150 s → 3 minutes).
    expect(errorResponse(retryLater(0)).headers).toEqual({ 'Retry-After': '1' });
    expect(errorResponse(retryLater(150)).body.message).toContain('Wait 3 minutes');
  });

  it('never sends the cause a library gave', () => {
    const err = badRequest('file: could not be read', [{ field: 'file', rule: 'could not be read' }], new Error('busboy: Unexpected end of form'));
    expect(JSON.stringify(errorResponse(err))).not.toContain('busboy');
  });
});
