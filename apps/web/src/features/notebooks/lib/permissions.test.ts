import { describe, expect, it } from 'vitest';
import { canEditCells, canRun } from './permissions';

describe('notebook permissions on screen', () => {
  it('lets owners and editors edit a draft, not reviewers or viewers', () => {
    expect(canEditCells({ myRole: 'owner', status: 'draft' })).toBe(true);
    expect(canEditCells({ myRole: 'editor', status: 'in_review' })).toBe(true);
    expect(canEditCells({ myRole: 'reviewer', status: 'draft' })).toBe(false);
    expect(canEditCells({ myRole: 'viewer', status: 'draft' })).toBe(false);
  });
  it('lets reviewers run cells to check them', () => {
    expect(canRun({ myRole: 'reviewer', status: 'in_review' })).toBe(true);
    expect(canRun({ myRole: 'viewer', status: 'in_review' })).toBe(false);
  });
  it('refuses every change on a locked notebook, even to its owner or an admin', () => {
    expect(canEditCells({ myRole: 'owner', status: 'locked' })).toBe(false);
    expect(canRun({ myRole: null, status: 'locked', siteRole: 'admin' })).toBe(false);
  });
});
