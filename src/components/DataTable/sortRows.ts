/**
 * Sorting for DataTable, kept pure so it is tested without rendering.
 * Empty values (null, undefined, NaN, '') always go last whichever the
 * direction, so a column of mostly blanks never hides the figures.
 * Text compares with the locale's rules and numbers embedded in codes in
 * numeric order ("S2" before "S10"), via Intl.Collator's `numeric` option.
 */
export type SortDirection = 'asc' | 'desc';
export type Sortable = string | number | boolean | Date | null | undefined;

export interface SortState {
  column: string;
  direction: SortDirection;
}

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });

function isBlank(v: Sortable): boolean {
  return v === null || v === undefined || v === '' || (typeof v === 'number' && Number.isNaN(v));
}

export function compareValues(a: Sortable, b: Sortable): number {
  const aBlank = isBlank(a);
  const bBlank = isBlank(b);
  if (aBlank || bBlank) return aBlank === bBlank ? 0 : aBlank ? 1 : -1;
  if (a instanceof Date && b instanceof Date) return a.getTime() - b.getTime();
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  if (typeof a === 'boolean' && typeof b === 'boolean') return Number(a) - Number(b);
  return collator.compare(String(a), String(b));
}

/** A sorted copy; rows that compare equal keep their original order (stable sort). */
export function sortRows<Row>(rows: readonly Row[], value: (row: Row) => Sortable, direction: SortDirection): Row[] {
  if (direction !== 'asc' && direction !== 'desc') {
    throw new Error(`sortRows: direction is "asc" or "desc", got ${JSON.stringify(direction)}`);
  }
  const sign = direction === 'asc' ? 1 : -1;
  return rows
    .map((row, index) => ({ row, index, key: value(row) }))
    .sort((x, y) => {
      const xBlank = isBlank(x.key);
      const yBlank = isBlank(y.key);
      if (xBlank !== yBlank) return xBlank ? 1 : -1;
      return sign * compareValues(x.key, y.key) || x.index - y.index;
    })
    .map((e) => e.row);
}

/** The next sort after pressing a column's header: a new column starts ascending, the same column flips. */
export function nextSort(current: SortState | null, column: string): SortState {
  if (current && current.column === column) {
    return { column, direction: current.direction === 'asc' ? 'desc' : 'asc' };
  }
  return { column, direction: 'asc' };
}
