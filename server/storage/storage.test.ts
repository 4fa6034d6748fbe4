import { describe, expect, it } from 'vitest';

import { assertValidKey, contentTypeFromKey, InvalidStorageKeyError } from './storage';

describe('assertValidKey', () => {
  it.each(['club-1/assessment-2/photo-3.jpg', '0b7c5a52-5d0e-4a8e-9a54-1f0c7c2f2a10/6f1e/9d2c.jpeg', 'photo.v2.png'])('accepts %s', (key) => {
    expect(() => assertValidKey(key)).not.toThrow();
  });

  it.each([
    ['', /empty/],
    ['../secrets.txt', /path traversal/],
    ['club/../../etc/passwd', /path traversal/],
    ['club/./photo.jpg', /path traversal/],
    ['/etc/passwd', /absolute/],
    ['C:/Windows/win.ini', /absolute/],
    ['club\\..\\photo.jpg', /backslash/],
    ['club//photo.jpg', /empty path segment/],
    ['club/photo.jpg/', /empty path segment/],
    ['club/.photo.jpg.meta.json', /must not start with '\.'/],
    ['club/photo 1.jpg', /may contain only/],
    ['club/photo\u0000.jpg', /may contain only/],
    ['a'.repeat(1025), /longer than 1024 bytes/],
  ])('refuses %j', (key, reason) => {
    expect(() => assertValidKey(key)).toThrow(InvalidStorageKeyError);
    expect(() => assertValidKey(key)).toThrow(reason);
  });
});

describe('contentTypeFromKey', () => {
  it.each([
    ['a/b/c.jpg', 'image/jpeg'],
    ['a/b/c.JPEG', 'image/jpeg'],
    ['a/b/c.png', 'image/png'],
    ['a/b/c.webp', 'image/webp'],
    ['a/b/c', 'application/octet-stream'],
    ['a.jpg/c', 'application/octet-stream'],
    ['a/b/c.bin', 'application/octet-stream'],
  ])('%s -> %s', (key, expected) => {
    expect(contentTypeFromKey(key)).toBe(expected);
  });
});
