import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { SignedInUser } from '../models/user';
import { Session } from '../session';
import { NotAllowedPage } from './not-allowed-page';

async function show(
  user: SignedInUser | null,
  url = '/not-allowed?needs=admin',
  problem: string | null = null,
): Promise<HTMLElement> {
  TestBed.configureTestingModule({
    providers: [
      {
        provide: Session,
        useValue: { user: signal(user).asReadonly(), problem: signal(problem).asReadonly() },
      },
      provideRouter(
        [{ path: 'not-allowed', component: NotAllowedPage }],
        withComponentInputBinding(),
      ),
    ],
  });
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  return harness.routeNativeElement as HTMLElement;
}

describe('NotAllowedPage', () => {
  it('asks an anonymous visitor to sign in, with a full-page link to /auth/github', async () => {
    const page = await show(null);

    expect(page.querySelector('h1')?.textContent).toBe('Not allowed');
    expect(page.textContent).toContain('This page needs the admin role. Sign in to continue.');
    const signIn = Array.from(page.querySelectorAll('a')).find((a) =>
      a.textContent?.includes('Sign in'),
    );
    expect(signIn?.getAttribute('href')).toBe('/auth/github');
  });

  it('tells a signed-in user which role they have and which one the page needs', async () => {
    const page = await show({
      id: 2,
      login: 'ebrandt',
      name: 'Elif Brandt',
      role: 'editor',
      avatarUrl: null,
    });

    expect(page.textContent?.replace(/\s+/g, ' ')).toContain(
      'You are signed in as ebrandt with the role editor. This page needs the admin role.',
    );
    expect(page.textContent).not.toContain('Sign in to continue');
  });

  it('ignores role names it does not know', async () => {
    const page = await show(null, '/not-allowed?needs=superuser');
    expect(page.textContent).toContain('This page needs a role you do not have.');
  });

  it('sends sign-in back to the page asked for', async () => {
    const page = await show(null, '/not-allowed?needs=admin&from=%2Fadmin%2Fusers');
    const signIn = Array.from(page.querySelectorAll('a')).find((a) =>
      a.textContent?.includes('Sign in'),
    );
    expect(signIn?.getAttribute('href')).toBe('/auth/github?returnTo=%2Fadmin%2Fusers');
  });

  it('does not call a busy server a refusal: no "Not allowed", no sign-in offered', async () => {
    const page = await show(
      null,
      '/not-allowed?needs=admin&from=%2Fadmin%2Fusers&unavailable=1',
      'Thalpos is receiving many requests from this address right now. Try again in 30 seconds; nothing you entered is lost.',
    );
    expect(page.querySelector('h1')?.textContent).toBe('Sign-in not confirmed yet');
    expect(page.textContent).toContain('Try again in 30 seconds');
    expect(page.textContent).not.toContain('Sign in to continue');
    expect(page.textContent).not.toContain('Not allowed');
  });
});
