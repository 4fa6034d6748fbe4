import { describe, expect, it } from 'vitest';
import { ApiError, fieldErrorsOf, messageOf } from './client';

describe('fieldErrorsOf', () => {
  it('returns the per-field messages of a validation error', () => {
    expect(fieldErrorsOf(new ApiError(400, 'invalid_input', 'Some fields need attention.', { email: 'Enter a valid e-mail address.' }))).toEqual({
      email: 'Enter a valid e-mail address.',
    });
  });
  it('returns null for errors without fields', () => {
    expect(fieldErrorsOf(new ApiError(409, 'conflict', 'Already a member.'))).toBeNull();
    expect(fieldErrorsOf(new Error('boom'))).toBeNull();
    expect(fieldErrorsOf('text')).toBeNull();
  });
});

describe('messageOf', () => {
  it('uses the message of an error, or the thrown value as text', () => {
    expect(messageOf(new ApiError(0, 'offline', 'No connection to Squadline.'))).toBe('No connection to Squadline.');
    expect(messageOf('plain text')).toBe('plain text');
  });
});
