import type { AuditRequest } from '../audit-api';

/** The filter form's values: dates as `yyyy-mm-dd` from date inputs. */
export interface AuditFilterValue {
  actor: string;
  action: string;
  entityType: string;
  entityId: string;
  fromDay: string;
  toDay: string;
}

/**
 * The request for one page: a day range is read in the browser's time zone, from the first
 * moment of the first day to the last moment of the last.
 */
export function auditRequest(
  filter: AuditFilterValue,
  pageIndex: number,
  pageSize: number,
): AuditRequest {
  return {
    actor: filter.actor,
    action: filter.action,
    entityType: filter.entityType,
    entityId: filter.entityId,
    from: dayBound(filter.fromDay, 'start'),
    to: dayBound(filter.toDay, 'end'),
    page: pageIndex + 1,
    pageSize,
  };
}

function dayBound(day: string, edge: 'start' | 'end'): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!m) return '';
  const [y, mo, d] = [Number(m[1]), Number(m[2]) - 1, Number(m[3])];
  const at = edge === 'start' ? new Date(y, mo, d) : new Date(y, mo, d, 23, 59, 59, 999);
  return at.toISOString();
}

/** Before and after as indented JSON for people; nothing recorded reads as a dash. */
export function formatState(value: unknown): string {
  return value === null || value === undefined ? '—' : JSON.stringify(value, null, 2);
}
