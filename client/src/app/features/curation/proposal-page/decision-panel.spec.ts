import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';

import { errorInterceptor } from '../../../core/error-interceptor';
import { DecisionPanel } from './decision-panel';

@Component({
  imports: [DecisionPanel],
  template: `<thalpos-decision-panel [proposalId]="7" (changed)="events.push($event)" />`,
})
class Host {
  readonly events: unknown[] = [];
  readonly own = signal(false);
}

/** Waits for the view to show something (an answer settles a promise, then the view renders). */
async function until<T>(
  find: () => T | null,
  fixture: { whenStable(): Promise<unknown> },
): Promise<T> {
  for (;;) {
    await fixture.whenStable();
    const found = find();
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

// The first test compiles Material components: slow on a busy machine, which must not fail it.
jest.setTimeout(60_000);

describe('DecisionPanel', () => {
  let backend: HttpTestingController;

  function setUp() {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(Host);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    return { fixture, loader };
  }

  afterEach(() => backend.verify());

  async function decide(
    loader: ReturnType<typeof setUp>['loader'],
    label: string,
    comment: string,
  ) {
    await (await loader.getHarness(MatRadioGroupHarness)).checkRadioButton({ label });
    await (
      await loader.getHarness(MatInputHarness.with({ selector: 'textarea' }))
    ).setValue(comment);
    const button = await loader.getHarness(MatButtonHarness.with({ selector: '[type=submit]' }));
    await button.click();
  }

  const refuse = (status: number, code: string, message: string) =>
    backend
      .expectOne({ method: 'POST', url: '/api/v1/proposals/7/decision' })
      .flush({ error: { code, message } }, { status, statusText: 'Refused' });

  it('needs a comment before anything is sent', async () => {
    const { fixture, loader } = setUp();
    await decide(loader, 'Approve', '   ');
    backend.expectNone('/api/v1/proposals/7/decision');
    expect(fixture.nativeElement.textContent).toMatch(/every decision needs one/);
  });

  it('sends the decision with its comment and reports the new state', async () => {
    const { fixture, loader } = setUp();
    await decide(loader, 'Ask for changes', 'Please cite the original paper.');
    const request = backend.expectOne({ method: 'POST', url: '/api/v1/proposals/7/decision' });
    expect(request.request.body).toEqual({
      decision: 'request_changes',
      comment: 'Please cite the original paper.',
    });
    request.flush({ id: 7, status: 'changes_requested', createdRevisionIds: [], warnings: [] });
    await fixture.whenStable();
    expect(fixture.componentInstance.events).toEqual([
      { answer: { id: 7, status: 'changes_requested', createdRevisionIds: [], warnings: [] } },
    ]);
  });

  it('explains a refusal of the own proposal in place, with the server’s message', async () => {
    const { fixture, loader } = setUp();
    await decide(loader, 'Approve', 'Looks right.');
    refuse(403, 'own_proposal', 'You proposed this yourself.');
    const alert = await until(
      () => fixture.nativeElement.querySelector('[role=alert]') as HTMLElement | null,
      fixture,
    );
    expect(alert.textContent).toMatch(/You cannot decide your own proposal\./);
    expect(alert.textContent).toMatch(/You proposed this yourself\./);
    expect(fixture.componentInstance.events).toEqual([]);
  });

  it('hands "already decided" and "stale" to the page to reload, with the server’s words', async () => {
    const { fixture, loader } = setUp();
    await decide(loader, 'Approve', 'Fine.');
    refuse(409, 'already_decided', 'Proposal 7 was approved by demo-editor-2 a moment ago.');
    await fixture.whenStable();
    await decide(loader, 'Reject', 'No.');
    refuse(
      409,
      'stale',
      'The value of methane (g) was superseded by revision 41 since submission.',
    );
    await fixture.whenStable();
    expect(fixture.componentInstance.events).toEqual([
      {
        refusal: {
          title: 'Someone else decided it first.',
          message: 'Proposal 7 was approved by demo-editor-2 a moment ago.',
          reload: true,
        },
      },
      {
        refusal: {
          title: 'The recorded value changed since this was submitted.',
          message: 'The value of methane (g) was superseded by revision 41 since submission.',
          reload: true,
        },
      },
    ]);
  });
});
