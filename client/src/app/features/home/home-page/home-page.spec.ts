import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { ROLES } from '../../../core/models/user';
import { HomePage } from './home-page';

describe('HomePage', () => {
  function render(): HTMLElement {
    TestBed.configureTestingModule({ providers: [provideRouter([])] });
    const fixture = TestBed.createComponent(HomePage);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('links only to screens that exist', () => {
    const page = render();
    const links = Array.from(page.querySelectorAll('a')).map((a) => a.getAttribute('href'));
    expect(new Set(links)).toEqual(
      new Set(['/calculate/hess', '/browse', '/calculate/reaction', '/releases']),
    );
  });

  it('lists exactly the four roles, and engineers and integrators as readers with a token', () => {
    const page = render();
    const roles = Array.from(page.querySelectorAll('.roles h3')).map((h) =>
      h.textContent?.trim().toLowerCase(),
    );
    expect(roles).toEqual([...ROLES]);
    const uses = Array.from(page.querySelectorAll('.uses li')).map((li) => li.textContent ?? '');
    expect(uses).toHaveLength(2);
    expect(uses[0]).toContain('Engineers');
    expect(uses[1]).toContain('Integrators');
    for (const use of uses) expect(use).toContain('Readers with an API token');
    expect(page.textContent).not.toMatch(/exports|checksums|diff/i);
  });
});
