import type { UploadFile } from '@/src/api/queries/network';

/** What the import takes (server/routes/network.ts): a JSON document, CSV files, zips of them. */
export const ACCEPTED_TYPES = ['.json', '.csv', '.zip', 'application/json', 'text/csv', 'application/zip'] as const;

export interface FilePickerProps {
  /** the control's visible label and accessible name */
  label: string;
  onPick: (files: UploadFile[]) => void;
  disabled?: boolean;
  testID?: string;
}
