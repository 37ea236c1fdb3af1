import { describe, expect, it } from 'vitest';
import { ApiError } from '@/src/api/client';
import { refusalFromError, STALE_MESSAGE } from './serverErrors';

const SITE_FIELDS = ['code', 'name', 'role', 'lat', 'lon', 'groundHeightM', 'mastHeightM', 'households', 'groups'];

describe('refusalFromError', () => {
  it('puts a 400 field message under its field', () => {
    const e = new ApiError(400, 'bad-request', 'site: lat: latitude is between -90 and 90', [{ field: 'lat', message: 'latitude is between -90 and 90' }]);
    expect(refusalFromError(e, SITE_FIELDS)).toEqual({ fields: { lat: 'latitude is between -90 and 90' } });
  });

  it('puts 422 rule messages about list items under the list, the first per field', () => {
    const e = new ApiError(422, 'invalid', 'site ZZ: group NOPE does not exist (and 1 more problem)', [
      { field: 'groups[0]', rule: 'unknown-reference', message: 'site ZZ: group NOPE does not exist' },
      { field: 'groups[1]', rule: 'unknown-reference', message: 'site ZZ: group NOPE2 does not exist' },
    ]);
    expect(refusalFromError(e, SITE_FIELDS)).toEqual({ fields: { groups: 'site ZZ: group NOPE does not exist' } });
  });

  it('puts a taken code under the code field', () => {
    const e = new ApiError(409, 'conflict', 'site M-CORR already exists; codes are unique within a kind', { code: 'M-CORR' });
    expect(refusalFromError(e, SITE_FIELDS)).toEqual({ fields: { code: 'site M-CORR already exists; codes are unique within a kind' } });
  });

  it('recognises a stale version and keeps the current record', () => {
    const current = { code: 'M-CORR', name: 'Corrant Beacon', version: 4 };
    const e = new ApiError(409, 'conflict', 'site M-CORR was changed by someone else since you read it', { currentVersion: 4, current });
    expect(refusalFromError(e, SITE_FIELDS)).toEqual({ fields: {}, form: STALE_MESSAGE, stale: { currentVersion: 4, current } });
  });

  it('puts a clash on a carriage\'s service under the service field', () => {
    const e = new ApiError(409, 'conflict', 'x', [{ field: 'service', rule: 'duplicate-carriage', message: 'site S already has carriage C2 for service FMA' }]);
    expect(refusalFromError(e, ['code', 'site', 'service'])).toEqual({ fields: { service: 'site S already has carriage C2 for service FMA' } });
  });

  it('sends what no field owns above the form', () => {
    expect(refusalFromError(new ApiError(400, 'bad-request', 'body: (body): bad', [{ field: '(body)', message: 'bad' }]), SITE_FIELDS)).toEqual({ fields: {}, form: 'bad' });
    expect(refusalFromError(new ApiError(500, 'internal', 'something went wrong on the server'), SITE_FIELDS)).toEqual({ fields: {}, form: 'something went wrong on the server' });
    expect(refusalFromError(new ApiError(403, 'forbidden', 'no'), SITE_FIELDS).form).toMatch(/role does not allow/);
    expect(refusalFromError(new Error('boom'), SITE_FIELDS)).toEqual({ fields: {}, form: 'boom' });
  });

  it('keeps field messages and also shows unplaced ones', () => {
    const e = new ApiError(422, 'invalid', 'x', [
      { field: 'to', message: 'feed F: receiving carriage C9 does not exist' },
      { field: 'weird', message: 'something else' },
    ]);
    expect(refusalFromError(e, ['code', 'from', 'to'])).toEqual({ fields: { to: 'feed F: receiving carriage C9 does not exist' }, form: 'something else' });
  });
});
