import { auditRequest, formatState, type AuditFilterValue } from './audit-filter';

const none: AuditFilterValue = {
  actor: '',
  action: '',
  entityType: '',
  entityId: '',
  fromDay: '',
  toDay: '',
};

describe('auditRequest', () => {
  it('reads a day range from the first to the last moment of the days, in local time', () => {
    const r = auditRequest({ ...none, fromDay: '2026-03-01', toDay: '2026-03-02' }, 0, 25);
    expect(new Date(r.from).getTime()).toBe(new Date(2026, 2, 1).getTime());
    expect(new Date(r.to).getTime()).toBe(new Date(2026, 2, 2, 23, 59, 59, 999).getTime());
  });

  it('leaves out a day that is not one, and counts pages from 1', () => {
    const r = auditRequest({ ...none, fromDay: 'not a day' }, 2, 50);
    expect(r).toEqual(expect.objectContaining({ from: '', to: '', page: 3, pageSize: 50 }));
  });
});

describe('formatState', () => {
  it('indents JSON and shows a dash where nothing was recorded', () => {
    expect(formatState({ role: 'editor' })).toBe('{\n  "role": "editor"\n}');
    expect(formatState(null)).toBe('—');
  });
});
