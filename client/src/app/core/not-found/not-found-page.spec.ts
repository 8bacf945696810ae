import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { NotFoundPage } from './not-found-page';

@Component({ template: 'home' })
class Home {}

describe('NotFoundPage', () => {
  it('answers an unknown address with "Page not found" and stays there, not a redirect home', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: '', component: Home },
          { path: '**', component: NotFoundPage },
        ]),
      ],
    });
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/calculate/hes?x=1');
    const page = harness.routeNativeElement as HTMLElement;

    expect(TestBed.inject(Router).url).toBe('/calculate/hes?x=1');
    expect(page.querySelector('h1')?.textContent).toBe('Page not found');
    expect(page.querySelector('code')?.textContent).toBe('/calculate/hes');
  });
});
