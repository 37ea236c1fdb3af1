/**
 * What one import request may hold, so that the largest allowed upload has a
 * known memory cost (README "Memory"). Sizes are counted in real bytes as
 * they are read (inflated bytes for a zip), across every file of the
 * request, and reading stops the moment a limit is passed.
 */
import { formatBytes, formatCount } from '@/shared/format';

export interface UploadLimits {
  /** bytes of CSV or JSON after unzipping, all files of one request together */
  maxBytes: number;
  /** data records (rows) of all CSV files together */
  maxRecords: number;
  /** characters of one CSV record: far above any valid row, far below the memory budget */
  maxRecordChars: number;
  /** entries of one zip, folders included */
  maxZipEntries: number;
}

/**
 * A 100,000-site network (national scale) is about 880,000 records, 52 MB of
 * CSV and 132 MB of JSON; leave room, refuse the absurd.
 */
export const UPLOAD_LIMITS: UploadLimits = {
  maxBytes: 160 * 1024 * 1024,
  maxRecords: 2_000_000,
  maxRecordChars: 256 * 1024,
  maxZipEntries: 100,
};

/** An upload over a limit: the route answers 413 with this message. */
export class UploadLimitError extends Error {}

const mb = formatBytes;

/** The bytes and records read so far by one request. */
export class UploadBudget {
  private bytes = 0;
  private records = 0;
  constructor(readonly limits: UploadLimits = UPLOAD_LIMITS) {}

  /** Sizes a zip's directory declares: refused before anything is inflated. */
  checkDeclared(bytes: number): void {
    if (this.bytes + bytes > this.limits.maxBytes) {
      throw new UploadLimitError(`the upload would unpack to ${mb(this.bytes + bytes)}; the limit is ${mb(this.limits.maxBytes)} for all files together`);
    }
  }

  addBytes(n: number): void {
    this.bytes += n;
    if (this.bytes > this.limits.maxBytes) throw new UploadLimitError(`the upload unpacks to more than ${mb(this.limits.maxBytes)}, the limit for all files together`);
  }

  addRecord(): void {
    if (++this.records > this.limits.maxRecords) {
      throw new UploadLimitError(`the upload holds more than ${formatCount(this.limits.maxRecords)} rows, the limit for one import`);
    }
  }
}
