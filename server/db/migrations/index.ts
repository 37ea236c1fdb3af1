/**
 * Every migration, in order. Listed here rather than globbed so that the same
 * list runs under tsx, vitest and any bundler; add new files at the end.
 */
import * as initialSchema from './0001-initial-schema';
import * as userSessions from './0002-user-sessions';
import * as operations from './0004-operations';
import * as noticesDocuments from './0005-notices-documents';
import * as searchAndPeopleChanges from './0009-search-and-people-changes';
import * as importProgress from './0010-import-progress';

export const migrations = [
  { name: '0001-initial-schema', ...initialSchema },
  { name: '0002-user-sessions', ...userSessions },
  { name: '0004-operations', ...operations },
  { name: '0005-notices-documents', ...noticesDocuments },
  { name: '0009-search-and-people-changes', ...searchAndPeopleChanges },
  { name: '0010-import-progress', ...importProgress },
];
