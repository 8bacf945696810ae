import { signal } from '@angular/core';

import { TablePager } from './table-pager';

describe('TablePager', () => {
  it('opens on the first page of 25 rows in the given sort', () => {
    const pager = new TablePager({ sort: { active: 'name', direction: 'asc' } });
    expect(pager.sort()).toEqual({ active: 'name', direction: 'asc' });
    expect(pager.requestedSort()).toEqual({ active: 'name', direction: 'asc' });
    expect(pager.pageIndex()).toBe(0);
    expect(pager.pageSize()).toBe(25);
    expect(pager.offset()).toBe(0);
  });

  it('takes page and size from the paginator and counts the rows before the page', () => {
    const pager = new TablePager({ pageSize: 10 });
    expect(pager.pageSize()).toBe(10);
    pager.turnPage({ pageIndex: 3, pageSize: 50, previousPageIndex: 2, length: 500 });
    expect(pager.pageIndex()).toBe(3);
    expect(pager.pageSize()).toBe(50);
    expect(pager.offset()).toBe(150);
  });

  it('starts again from the first page on a new sort', () => {
    const pager = new TablePager({ sort: { active: 'name', direction: 'asc' } });
    pager.turnPage({ pageIndex: 2, pageSize: 25, length: 100 });
    pager.sortBy({ active: 'formula', direction: 'desc' });
    expect(pager.sort()).toEqual({ active: 'formula', direction: 'desc' });
    expect(pager.requestedSort()).toEqual({ active: 'formula', direction: 'desc' });
    expect(pager.pageIndex()).toBe(0);
    expect(pager.pageSize()).toBe(25);
  });

  it('asks for the default sort while the headers show none, and shows them as they are', () => {
    const pager = new TablePager({ sort: { active: 'submittedAt', direction: 'asc' } });
    pager.sortBy({ active: 'status', direction: '' });
    expect(pager.sort()).toEqual({ active: 'status', direction: '' });
    expect(pager.requestedSort()).toEqual({ active: 'submittedAt', direction: 'asc' });
  });

  it('goes back to the first page when asked, keeping the page size', () => {
    const pager = new TablePager();
    pager.turnPage({ pageIndex: 4, pageSize: 100, length: 1000 });
    pager.firstPage();
    expect(pager.pageIndex()).toBe(0);
    expect(pager.pageSize()).toBe(100);
  });

  it('goes back to the first page whenever the signal it restarts on changes', () => {
    const file = signal('first.csv');
    const pager = new TablePager({ restartOn: file });
    pager.turnPage({ pageIndex: 2, pageSize: 25, length: 100 });
    expect(pager.pageIndex()).toBe(2);
    file.set('second.csv');
    expect(pager.pageIndex()).toBe(0);
    pager.turnPage({ pageIndex: 1, pageSize: 25, length: 100 });
    expect(pager.pageIndex()).toBe(1);
  });
});
