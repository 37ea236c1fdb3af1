import { describe, expect, it } from 'vitest';
import { ApiError } from '@/src/api/client';
import { deleteButtonLabel, deleteRefusal } from './deleteRefusal';

describe('deleteRefusal', () => {
  it('reads the dependents of a site and offers to delete them all', () => {
    const e = new ApiError(409, 'conflict', 'site M-CORR still has 11 carriages (M-CORR.DBN, M-CORR.DBR) and 56 feeds (M-CORR.DBN.M); delete them first, or delete with cascade=true to delete them too', {
      dependents: { carriages: { count: 11, codes: ['M-CORR.DBN', 'M-CORR.DBR'] }, feeds: { count: 56, codes: ['M-CORR.DBN.M'] } },
    });
    const r = deleteRefusal('sites', e);
    expect(r).toEqual({
      reason: 'dependents',
      message: 'site M-CORR still has 11 carriages (M-CORR.DBN, M-CORR.DBR) and 56 feeds (M-CORR.DBN.M). Delete them first, or choose below to delete them too.',
      total: 67,
      dependents: [
        { kind: 'carriages', count: 11, codes: ['M-CORR.DBN', 'M-CORR.DBR'] },
        { kind: 'feeds', count: 56, codes: ['M-CORR.DBN.M'] },
      ],
      cascadeLabel: 'Also delete 67 dependents (11 carriages and 56 feeds)',
    });
  });

  it('says a group\'s members leave it rather than being deleted', () => {
    const e = new ApiError(409, 'conflict', 'group G has members: 1 site (S1); take them out of the group first, or delete with cascade=true to take them out', {
      dependents: { sites: { count: 1, codes: ['S1'] } },
    });
    const r = deleteRefusal('groups', e);
    expect(r.reason).toBe('dependents');
    if (r.reason !== 'dependents') return;
    expect(r.cascadeLabel).toBe('Also take its 1 member out of the group (1 site)');
    expect(r.message).toBe('group G has members: 1 site (S1). Take them out of the group first, or choose below to do it with the delete.');
  });

  it('tells a stale version from dependents, and passes other refusals on', () => {
    expect(deleteRefusal('feeds', new ApiError(409, 'conflict', 'changed', { currentVersion: 3, current: {} })).reason).toBe('stale');
    expect(deleteRefusal('feeds', new ApiError(404, 'not-found', 'no feed with code F'))).toEqual({ reason: 'other', message: 'no feed with code F' });
    expect(deleteRefusal('feeds', new ApiError(409, 'conflict', 'odd', { dependents: { feeds: { count: 0 } } }))).toEqual({ reason: 'other', message: 'odd' });
  });
});

describe('deleteButtonLabel', () => {
  it('names the record and what goes with it', () => {
    expect(deleteButtonLabel('sites', 'S1', null)).toBe('Delete site S1');
    expect(deleteButtonLabel('sites', 'S1', 1)).toBe('Delete site S1 and 1 dependent');
    expect(deleteButtonLabel('carriages', 'C', 3)).toBe('Delete carriage C and 3 dependents');
    expect(deleteButtonLabel('groups', 'G', 2)).toBe('Delete group G and release 2 members');
  });
});

describe('a refusal for documents', () => {
  it('reads the count and drops the API wording', () => {
    const r = deleteRefusal('sites', new ApiError(409, 'conflict', 'site H1 has 2 documents; delete again with documents=delete to delete them too, or documents=keep to keep them', { documents: 2 }));
    expect(r).toEqual({ reason: 'documents', count: 2, message: 'site H1 has 2 documents. Choose below what happens to them.' });
  });
});
