import { BreakpointObserver, Breakpoints } from '@angular/cdk/layout';
import { inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { map } from 'rxjs';

/**
 * Whether the screen is phone-sized (Material's XSmall, below 600 px), as a signal: tables pick
 * the columns that fit. Call it in an injection context (a field initializer).
 */
export function phoneWidth(): Signal<boolean> {
  return toSignal(
    inject(BreakpointObserver)
      .observe(Breakpoints.XSmall)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
}
