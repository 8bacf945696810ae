import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, inject } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { ActivatedRoute, provideRouter, Router, RouterOutlet } from '@angular/router';

import type { SignedInUser } from '../models/user';
import { Session } from '../session';
import { Shell } from './shell';

/** Stands for a routed screen: says which path it was routed for. */
@Component({ template: '<p class="routed">{{ path }}</p>' })
class Screen {
  protected readonly path = inject(ActivatedRoute).snapshot.routeConfig?.path;
}

@Component({
  imports: [Shell, RouterOutlet],
  template: '<thalpos-shell><router-outlet /></thalpos-shell>',
})
class Host {}

const paths = [
  'browse',
  'calculate/reaction',
  'calculate/hess',
  'curation/propose',
  'proposals/upload',
  'curation/proposals',
  'curation/proposals/:id',
  'curation/review',
];

const user = (role: SignedInUser['role']): SignedInUser => ({
  id: 3,
  login: 'tkhan',
  name: 'Tariq Khan',
  role,
  avatarUrl: null,
});

describe('Shell sub-navigation', () => {
  let fixture: ComponentFixture<Host>;
  let element: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [Host],
      providers: [
        provideRouter(paths.map((path) => ({ path, component: Screen }))),
        provideHttpClient(),
        provideHttpClientTesting(),
      ],
    });
    fixture = TestBed.createComponent(Host);
    element = fixture.nativeElement as HTMLElement;
  });

  async function signIn(role: SignedInUser['role']): Promise<void> {
    const known = TestBed.inject(Session).refresh();
    TestBed.inject(HttpTestingController).expectOne('/api/v1/me').flush(user(role));
    await known;
  }

  async function open(url: string): Promise<void> {
    await TestBed.inject(Router).navigateByUrl(url);
    await fixture.whenStable();
  }

  const tabs = () => Array.from(element.querySelectorAll<HTMLElement>('[role="tab"]'));
  const tabLabels = () => tabs().map((t) => t.textContent?.trim());
  const selected = () =>
    tabs()
      .filter((t) => t.getAttribute('aria-selected') === 'true')
      .map((t) => t.textContent?.trim());
  const panel = () => element.querySelector<HTMLElement>('[role="tabpanel"]');
  const routed = () => element.querySelector('.routed')?.textContent;

  it('shows the calculation screens as tabs whose panel holds the routed screen', async () => {
    await open('/calculate/hess');

    const nav = element.querySelector('nav[aria-label="Calculate"]');
    expect(nav?.querySelector('[role="tablist"]')?.getAttribute('aria-label')).toBe(
      'Calculate screens',
    );
    expect(tabLabels()).toEqual(['Reaction enthalpy', 'Hess combination']);
    expect(selected()).toEqual(['Hess combination']);
    const active = tabs()[1];
    expect(panel()?.getAttribute('aria-labelledby')).toBe(active.id);
    expect(active.getAttribute('aria-controls')).toBe(panel()?.id);
    expect(panel()?.querySelector('.routed')?.textContent).toBe('calculate/hess');
  });

  it('moves the routed screen in and out of the panel as sections change', async () => {
    await open('/browse');
    expect(panel()).toBeNull();
    expect(routed()).toBe('browse');

    await open('/calculate/reaction');
    expect(selected()).toEqual(['Reaction enthalpy']);
    expect(panel()?.querySelector('.routed')?.textContent).toBe('calculate/reaction');

    await open('/browse');
    expect(tabs()).toHaveLength(0);
    expect(panel()).toBeNull();
    expect(element.querySelectorAll('.routed')).toHaveLength(1);
    expect(routed()).toBe('browse');
  });

  it('gives a curator three curation tabs and an editor the review queue too', async () => {
    await signIn('curator');
    await open('/proposals/upload');
    expect(tabLabels()).toEqual(['Propose', 'Bulk upload', 'My proposals']);
    expect(selected()).toEqual(['Bulk upload']);

    await signIn('editor');
    await open('/curation/review');
    expect(tabLabels()).toEqual(['Propose', 'Bulk upload', 'My proposals', 'Review']);
    expect(selected()).toEqual(['Review']);
  });

  it('selects no curation tab on a proposal of its own', async () => {
    await signIn('editor');
    await open('/curation/proposals/7');
    expect(tabLabels()).toHaveLength(4);
    expect(selected()).toEqual([]);
    expect(routed()).toBe('curation/proposals/:id');
  });

  it('shows no curation tabs to a reader', async () => {
    await signIn('reader');
    await open('/curation/propose');
    expect(tabs()).toHaveLength(0);
    expect(routed()).toBe('curation/propose');
  });
});
