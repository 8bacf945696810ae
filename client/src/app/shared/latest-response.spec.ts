import { HttpErrorResponse } from '@angular/common/http';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject, type Observable } from 'rxjs';

import { latestResponse, type LatestResponseOptions } from './latest-response';

interface Request {
  readonly page: number;
}

describe('latestResponse', () => {
  /** Each load answers through its own subject, so a test decides when and how it ends. */
  let calls: { request: Request; answer: Subject<string> }[];
  const load = (request: Request): Observable<string> => {
    const answer = new Subject<string>();
    calls.push({ request, answer });
    return answer;
  };

  beforeEach(() => {
    calls = [];
  });

  function start(options: Omit<LatestResponseOptions<Request, string>, 'load'>) {
    return TestBed.runInInjectionContext(() => latestResponse({ ...options, load }));
  }

  it('is loading at once, asks for the request and shows the answer', () => {
    const request = signal<Request>({ page: 1 });
    const response = start({ request });
    expect(response.state()).toEqual({ state: 'loading' });
    expect(response.loading()).toBe(true);

    TestBed.tick();
    expect(calls.map((c) => c.request)).toEqual([{ page: 1 }]);
    calls[0]!.answer.next('page one');
    expect(response.state()).toEqual({ state: 'loaded', value: 'page one' });
    expect(response.last()).toBe('page one');
    expect(response.loading()).toBe(false);
    expect(response.failure()).toBeNull();
  });

  it('drops the request in flight for a new one, keeping the last answer on screen', () => {
    const request = signal<Request>({ page: 1 });
    const response = start({ request });
    TestBed.tick();
    calls[0]!.answer.next('page one');
    expect(response.last()).toBe('page one');

    request.set({ page: 2 });
    TestBed.tick();
    expect(response.loading()).toBe(true);
    expect(response.last()).toBe('page one');

    request.set({ page: 3 });
    TestBed.tick();
    expect(calls.map((c) => c.request)).toEqual([{ page: 1 }, { page: 2 }, { page: 3 }]);
    expect(calls[1]!.answer.observed).toBe(false);
    expect(calls[2]!.answer.observed).toBe(true);
    calls[2]!.answer.next('page three');
    expect(response.last()).toBe('page three');
  });

  it('turns a failure into a readable message and clears the last answer', () => {
    const request = signal<Request>({ page: 1 });
    const response = start({ request });
    TestBed.tick();
    calls[0]!.answer.next('page one');
    expect(response.last()).toBe('page one');

    request.set({ page: 2 });
    TestBed.tick();
    calls[1]!.answer.error(
      new HttpErrorResponse({
        status: 403,
        error: { error: { code: 'forbidden', message: 'This needs the editor role' } },
      }),
    );
    expect(response.state()).toEqual({ state: 'failed', message: 'This needs the editor role' });
    expect(response.failure()).toBe('This needs the editor role');
    expect(response.loading()).toBe(false);
    expect(response.last()).toBeNull();

    // The stream lives on: the next request is asked as usual.
    request.set({ page: 3 });
    TestBed.tick();
    expect(calls).toHaveLength(3);
    expect(response.loading()).toBe(true);
  });

  it('keeps the last answer after a failure when asked to', () => {
    const request = signal<Request>({ page: 1 });
    const response = start({ request, keepOnFailure: true });
    TestBed.tick();
    calls[0]!.answer.next('page one');
    expect(response.last()).toBe('page one');
    request.set({ page: 2 });
    TestBed.tick();
    calls[1]!.answer.error(new Error('offline'));
    expect(response.failure()).toBe('offline');
    expect(response.last()).toBe('page one');
  });

  it('asks the same request again on reload', () => {
    const request = signal<Request>({ page: 1 });
    const response = start({ request });
    TestBed.tick();
    calls[0]!.answer.error(new Error('offline'));

    response.reload();
    TestBed.tick();
    expect(calls.map((c) => c.request)).toEqual([{ page: 1 }, { page: 1 }]);
    expect(response.loading()).toBe(true);
    calls[1]!.answer.next('page one');
    expect(response.last()).toBe('page one');
  });

  it('stays idle and asks nothing while the request is null', () => {
    const request = signal<Request | null>(null);
    const response = start({ request });
    expect(response.state()).toEqual({ state: 'idle' });
    TestBed.tick();
    expect(response.state()).toEqual({ state: 'idle' });
    expect(response.loading()).toBe(false);
    expect(calls).toHaveLength(0);

    request.set({ page: 1 });
    TestBed.tick();
    expect(calls).toHaveLength(1);
    calls[0]!.answer.next('page one');
    request.set(null);
    TestBed.tick();
    expect(response.state()).toEqual({ state: 'idle' });
    expect(response.last()).toBeNull();
  });
});
