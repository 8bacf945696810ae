import { BreakpointObserver, Breakpoints, type BreakpointState } from '@angular/cdk/layout';
import { TestBed } from '@angular/core/testing';
import { BehaviorSubject } from 'rxjs';

import { phoneWidth } from './phone-width';

describe('phoneWidth', () => {
  it('follows the XSmall breakpoint as the screen changes size', () => {
    const state = new BehaviorSubject<BreakpointState>({ matches: false, breakpoints: {} });
    const asked: string[] = [];
    TestBed.configureTestingModule({
      providers: [
        {
          provide: BreakpointObserver,
          useValue: {
            observe: (query: string) => {
              asked.push(query);
              return state;
            },
          },
        },
      ],
    });
    const phone = TestBed.runInInjectionContext(() => phoneWidth());
    expect(asked).toEqual([Breakpoints.XSmall]);
    expect(phone()).toBe(false);
    state.next({ matches: true, breakpoints: { [Breakpoints.XSmall]: true } });
    expect(phone()).toBe(true);
  });
});
