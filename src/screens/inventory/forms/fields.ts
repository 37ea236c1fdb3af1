/**
 * The fields of each kind's form, in the order of docs/format.md (docs/api.md
 * section 1), except that a carriage starts with its site and service and a
 * feed with its two ends, since its code is proposed from them; with the
 * label a person sees (and a screen reader reads) and how the typed text
 * turns into the document's value.
 */
import { FEED_ROLES, MEDIA, POLARISATIONS, SERVICE_KINDS, SITE_ROLES, type EntityKind } from '@/shared/schemas/network';
import { FEED_ROLE_WORDS, SERVICE_KIND_WORDS, SITE_TYPE_WORDS } from '@/shared/words';

export type FieldType =
  /** a code (monospaced text) */
  | 'code'
  | 'text'
  /** a decimal number */
  | 'number'
  /** a whole number */
  | 'int'
  /** one of `options` */
  | 'choice'
  /** a list of codes typed as "A; B" */
  | 'codes'
  /** yes or no */
  | 'flag';

export interface FieldSpec {
  name: string;
  label: string;
  type: FieldType;
  /** for choice fields */
  options?: readonly string[];
  /** words shown for an option, when its value alone is terse ("H" -> "H, horizontal") */
  optionLabels?: Record<string, string>;
  /** the unit, said in the hint and shown beside values; labels stay plain ("Latitude") as accessible names */
  unit?: string;
  required: boolean;
  hint?: string;
  /** a codes list whose order means nothing (groups), so repeats are dropped */
  isSet?: boolean;
  /** a code (or list of codes) chosen with a searchable picker (./CodePicker.tsx) from these records */
  picker?: 'sites' | 'services' | 'groups' | 'carriages' | 'sources';
}

const code: FieldSpec = { name: 'code', label: 'Code', type: 'code', required: true, hint: 'Letters, digits, "-", "_" or "."; it cannot change later.' };
/** Carriages and feeds: the form proposes the code from the fields it is made of (./formAssist.ts). */
const proposedCode: FieldSpec = { ...code, hint: 'Proposed from the fields below; change it if you like. Letters, digits, "-", "_" or "."; it cannot change later.' };
const name: FieldSpec = { name: 'name', label: 'Name', type: 'text', required: true };
const groups: FieldSpec = { name: 'groups', label: 'Shared-risk groups', type: 'codes', required: false, isSet: true, picker: 'groups', hint: 'Search by code or name to add a group (optional).' };

export const FORM_FIELDS: Record<EntityKind, readonly FieldSpec[]> = {
  sites: [
    code,
    name,
    { name: 'role', label: 'Site type', type: 'choice', options: SITE_ROLES, optionLabels: SITE_TYPE_WORDS, required: true },
    { name: 'lat', label: 'Latitude', type: 'number', unit: 'deg', required: true, hint: 'WGS84 degrees, -90 to 90 (south is negative).' },
    { name: 'lon', label: 'Longitude', type: 'number', unit: 'deg', required: true, hint: 'WGS84 degrees, -180 to 180 (west is negative).' },
    { name: 'groundHeightM', label: 'Ground height', type: 'number', unit: 'm', required: false, hint: 'Metres above sea level (optional).' },
    { name: 'mastHeightM', label: 'Mast height', type: 'number', unit: 'm', required: false, hint: 'Metres above ground (optional).' },
    { name: 'households', label: 'Households', type: 'int', required: false, hint: 'Households served (optional).' },
    groups,
  ],
  services: [code, name, { name: 'kind', label: 'Kind', type: 'choice', options: SERVICE_KINDS, optionLabels: SERVICE_KIND_WORDS, required: true }],
  groups: [code, name, { name: 'note', label: 'Note', type: 'text', required: false, hint: 'What fails together, and why (optional).' }],
  carriages: [
    { name: 'site', label: 'Site', type: 'code', required: true, picker: 'sites', hint: 'The site that radiates it: search by code or name.' },
    { name: 'service', label: 'Service', type: 'code', required: true, picker: 'services', hint: 'The service it radiates: search by code or name.' },
    proposedCode,
    { name: 'channel', label: 'Channel', type: 'code', required: false, hint: 'UHF channel or DAB block, e.g. 21 or 12B (optional); fills the frequency.' },
    { name: 'frequencyMHz', label: 'Frequency', type: 'number', unit: 'MHz', required: false, hint: 'MHz (optional); filled from the channel.' },
    { name: 'erpW', label: 'ERP', type: 'number', unit: 'W', required: false, hint: 'Effective radiated power in W (optional).' },
    {
      name: 'polarisation',
      label: 'Polarisation',
      type: 'choice',
      options: POLARISATIONS,
      optionLabels: { H: 'H, horizontal', V: 'V, vertical', M: 'M, mixed', C: 'C, circular' },
      required: false,
    },
    { name: 'antennaHeightM', label: 'Antenna height', type: 'number', unit: 'm', required: false, hint: 'Metres above ground (optional).' },
    { name: 'onChannelRepeater', label: 'On-channel repeater', type: 'flag', required: false, hint: 'It may transmit on the channel it receives.' },
  ],
  feeds: [
    { name: 'to', label: 'Receiving carriage', type: 'code', required: true, picker: 'carriages', hint: 'The carriage this feed brings programme into: search by code, site or service.' },
    { name: 'from', label: 'Source carriage', type: 'code', required: true, picker: 'sources', hint: 'The parent carriage the programme comes from: once the receiving carriage is chosen, the nearest of its service come first.' },
    { name: 'medium', label: 'Medium', type: 'choice', options: MEDIA, required: true },
    { name: 'role', label: 'Main or reserve', type: 'choice', options: FEED_ROLES, optionLabels: FEED_ROLE_WORDS, required: true },
    proposedCode,
    { name: 'via', label: 'Via sites', type: 'codes', required: false, picker: 'sites', hint: 'Sites the path passes through, in order: search to add each (optional).' },
    groups,
    { name: 'rxFrequencyMHz', label: 'Receive frequency', type: 'number', unit: 'MHz', required: false, hint: 'MHz (optional).' },
    { name: 'rxChannel', label: 'Receive channel', type: 'code', required: false, hint: 'Optional.' },
    { name: 'rxAntenna', label: 'Receive antenna', type: 'text', required: false, hint: 'Optional.' },
    { name: 'bearingDeg', label: 'Recorded bearing', type: 'number', unit: 'deg', required: false, hint: 'Degrees from true north, 0-360 (optional).' },
  ],
};
