import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl } from '@angular/forms';

import { NumberInput } from './number-input';
import { numberText } from './number-text';

@Component({
  imports: [NumberInput],
  template: `<thalpos-number-input [control]="control" label="ΔH" ariaLabel="Step 1 ΔH" />`,
})
class Host {
  readonly control = new FormControl('', {
    nonNullable: true,
    validators: numberText({ required: true }),
  });
}

describe('NumberInput', () => {
  function setUp() {
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    const input: HTMLInputElement = fixture.nativeElement.querySelector('input');
    const type = async (text: string) => {
      input.value = text;
      input.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      fixture.detectChanges();
    };
    return { fixture, input, type };
  }

  it('is a text field, so the browser never drops a typographic minus', async () => {
    const { fixture, input, type } = setUp();
    expect(input.type).toBe('text');
    expect(input.getAttribute('inputmode')).toBe('decimal');
    expect(input.getAttribute('aria-label')).toBe('Step 1 ΔH');
    await type('\u2212283.0');
    expect(fixture.componentInstance.control.value).toBe('\u2212283.0');
    expect(fixture.componentInstance.control.valid).toBe(true);
  });

  it('shows the refusal while typing', async () => {
    const { fixture, type } = setUp();
    await type('1,234');
    expect(fixture.nativeElement.querySelector('mat-error')?.textContent).toMatch(
      /1,234 is ambiguous/,
    );
  });
});
