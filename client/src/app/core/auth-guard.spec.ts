import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { roleGuard } from './auth-guard';
import type { SignedInUser } from './models/user';
import { Session, type SessionStatus } from './session';

@Component({ template: 'user administration' })
class GuardedPage {}

@Component({ template: 'refused' })
class RefusedPage {}

function sessionWith(
  user: SignedInUser | null,
  status: SessionStatus = user ? 'signed-in' : 'anonymous',
): Partial<Session> {
  return { whenKnown: () => Promise.resolve(user), status: signal(status).asReadonly() };
}

async function visitAdmin(
  user: SignedInUser | null,
  status?: SessionStatus,
): Promise<{ url: string; text: string }> {
  TestBed.configureTestingModule({
    providers: [
      { provide: Session, useValue: sessionWith(user, status) },
      provideRouter([
        { path: 'admin/users', canMatch: [roleGuard('admin')], component: GuardedPage },
        { path: 'not-allowed', component: RefusedPage },
      ]),
    ],
  });
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl('/admin/users');
  return { url: TestBed.inject(Router).url, text: harness.routeNativeElement?.textContent ?? '' };
}

const person = (role: SignedInUser['role']): SignedInUser => ({
  id: 1,
  login: 'tnakamura',
  name: 'Taro Nakamura',
  role,
  avatarUrl: null,
});

describe('roleGuard', () => {
  it('lets an admin open an admin page', async () => {
    const { url, text } = await visitAdmin(person('admin'));
    expect(url).toBe('/admin/users');
    expect(text).toContain('user administration');
  });

  it.each(['reader', 'curator', 'editor'] as const)(
    'sends a signed-in %s to the not-allowed page, naming the role needed',
    async (role) => {
      const { url, text } = await visitAdmin(person(role));
      expect(url).toBe('/not-allowed?needs=admin&from=%2Fadmin%2Fusers');
      expect(text).toContain('refused');
    },
  );

  it('sends an anonymous visitor to the not-allowed page, remembering the page asked for', async () => {
    const { url } = await visitAdmin(null);
    expect(url).toBe('/not-allowed?needs=admin&from=%2Fadmin%2Fusers');
  });

  it('does not read a session it could not load (e.g. 429) as anonymous', async () => {
    const { url } = await visitAdmin(null, 'unavailable');
    expect(url).toBe('/not-allowed?needs=admin&from=%2Fadmin%2Fusers&unavailable=1');
  });
});
