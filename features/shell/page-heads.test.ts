import { describe, expect, it } from 'vitest';
import { isCapturePath, PAGE_HEADS, pageHeadFor } from './page-heads';

describe('pageHeadFor (our choice: the pre-rendered head of each page)', () => {
  it.each([
    ['/', PAGE_HEADS.home],
    ['/screening', PAGE_HEADS.screening],
    ['/measuring', PAGE_HEADS.measuring],
    ['/trends', PAGE_HEADS.trends],
    ['/audit', PAGE_HEADS.audit],
    ['/screening/rounds/5d0b7c1e-8f0a-4c55-9f43-2b1f8f9d9a01', PAGE_HEADS.round],
    // The export pre-renders the round page under its file's own name.
    ['/screening/rounds/[id]', PAGE_HEADS.round],
  ])('%s has its own head', (path, head) => {
    expect(pageHeadFor(path)).toBe(head);
  });

  it.each(['/screening/rounds/5d0b7c1e-8f0a-4c55-9f43-2b1f8f9d9a01/x', '/athletes/5d0b7c1e-8f0a-4c55-9f43-2b1f8f9d9a01', '/family/x', '/unknown'])(
    '%s waits for its data (no head)',
    (path) => {
      expect(pageHeadFor(path)).toBeNull();
    },
  );
});

describe('isCapturePath (our choice: the capture screen pre-renders its own frame)', () => {
  it.each([
    ['/screening/assessments/5d0b7c1e-8f0a-4c55-9f43-2b1f8f9d9a01', true],
    ['/screening/assessments/5d0b7c1e-8f0a-4c55-9f43-2b1f8f9d9a01/', true],
    ['/screening/assessments/5d0b7c1e-8f0a-4c55-9f43-2b1f8f9d9a01/result', false],
    ['/screening/rounds/5d0b7c1e-8f0a-4c55-9f43-2b1f8f9d9a01', false],
    ['/screening', false],
  ])('%s: %s', (path, expected) => {
    expect(isCapturePath(path)).toBe(expected);
  });
});
