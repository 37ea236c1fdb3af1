/**
 * What each kind's list shows of a record: the table's columns on a wide
 * screen, and the card's lines on a phone. Units are in the column headers
 * and in the card's words.
 */
import type { DataColumn } from '@/src/components/DataTable/DataTable';
import type { StoredEntities } from '@/src/api/schemas';
import type { EntityKind } from '@/shared/schemas/network';
import { codesText, erpText, figure, householdsText, withUnit } from '@/shared/format';
import { feedRoleWord, serviceKindWord, siteTypeWord } from '@/shared/words';

export interface CardLines {
  /** the code, shown in the monospaced face */
  code: string;
  /** the name or the main fact, beside the code */
  title: string;
  /** a short word in a badge: the role, the kind, the medium */
  tag?: string;
  /** further facts, each with its unit */
  facts: string[];
}

export interface RowView<Row> {
  columns: DataColumn<Row>[];
  card: (row: Row) => CardLines;
}

const code = <Row extends { code: string }>(): DataColumn<Row> => ({ key: 'code', label: 'Code', mono: true, width: 170, value: (r) => r.code, sortable: false });

const sites: RowView<StoredEntities['sites']> = {
  columns: [
    code(),
    { key: 'name', label: 'Name', width: 200, value: (r) => r.name, sortable: false },
    { key: 'role', label: 'Site type', width: 130, value: (r) => siteTypeWord(r.role), sortable: false },
    { key: 'households', label: 'Households', numeric: true, width: 130, value: (r) => r.households, format: (v) => figure(v as number | undefined), sortable: false },
    { key: 'mast', label: 'Mast', unit: 'm', numeric: true, width: 100, value: (r) => r.mastHeightM, format: (v) => figure(v as number | undefined), sortable: false },
    { key: 'groups', label: 'Groups', width: 180, value: (r) => (r.groups?.length ? r.groups.join('; ') : ''), sortable: false },
  ],
  card: (r) => ({
    code: r.code,
    title: r.name,
    tag: siteTypeWord(r.role),
    facts: [householdsText(r.households), r.mastHeightM !== undefined ? `mast ${withUnit(r.mastHeightM, 'm')}` : 'mast height not recorded'],
  }),
};

const services: RowView<StoredEntities['services']> = {
  columns: [code(), { key: 'name', label: 'Name', width: 260, value: (r) => r.name, sortable: false }, { key: 'kind', label: 'Kind', width: 160, value: (r) => serviceKindWord(r.kind), sortable: false }],
  card: (r) => ({ code: r.code, title: r.name, tag: serviceKindWord(r.kind), facts: [] }),
};

const groups: RowView<StoredEntities['groups']> = {
  columns: [code(), { key: 'name', label: 'Name', width: 260, value: (r) => r.name, sortable: false }, { key: 'note', label: 'Note', width: 320, value: (r) => r.note ?? '', sortable: false }],
  card: (r) => ({ code: r.code, title: r.name, facts: r.note ? [r.note] : [] }),
};

const carriages: RowView<StoredEntities['carriages']> = {
  columns: [
    code(),
    { key: 'site', label: 'Site', mono: true, width: 120, value: (r) => r.site, sortable: false },
    { key: 'service', label: 'Service', mono: true, width: 100, value: (r) => r.service, sortable: false },
    { key: 'frequency', label: 'Frequency', unit: 'MHz', numeric: true, width: 140, value: (r) => r.frequencyMHz, format: (v) => figure(v as number | undefined, 3), sortable: false },
    { key: 'channel', label: 'Channel', mono: true, width: 100, value: (r) => r.channel ?? '', sortable: false },
    { key: 'erp', label: 'ERP', numeric: true, width: 110, value: (r) => r.erpW, format: (v) => erpText(v as number | undefined), sortable: false },
    { key: 'pol', label: 'Pol.', width: 70, value: (r) => r.polarisation ?? '', sortable: false },
  ],
  card: (r) => ({
    code: r.code,
    title: `${r.service} at ${r.site}`,
    facts: [
      r.frequencyMHz !== undefined ? withUnit(r.frequencyMHz, 'MHz', 3) : 'frequency not recorded',
      ...(r.channel ? [`channel ${r.channel}`] : []),
      r.erpW !== undefined ? `ERP ${erpText(r.erpW)}` : 'ERP not recorded',
    ],
  }),
};

const feeds: RowView<StoredEntities['feeds']> = {
  columns: [
    code(),
    { key: 'from', label: 'Source carriage', mono: true, width: 160, value: (r) => r.from, sortable: false },
    { key: 'to', label: 'Receiving carriage', mono: true, width: 160, value: (r) => r.to, sortable: false },
    { key: 'medium', label: 'Medium', width: 110, value: (r) => r.medium, sortable: false },
    { key: 'role', label: 'Main or reserve', width: 130, value: (r) => feedRoleWord(r.role), sortable: false },
    { key: 'via', label: 'Via', mono: true, width: 120, value: (r) => (r.via?.length ? r.via.join('; ') : ''), sortable: false },
  ],
  card: (r) => ({
    code: r.code,
    title: `${r.from} to ${r.to}`,
    tag: `${feedRoleWord(r.role)}, ${r.medium}`,
    facts: [...(r.via?.length ? [`via ${codesText(r.via)}`] : []), ...(r.groups?.length ? [`groups ${codesText(r.groups)}`] : [])],
  }),
};

export const ROW_VIEWS: { [K in EntityKind]: RowView<StoredEntities[K]> } = { sites, services, groups, carriages, feeds };
