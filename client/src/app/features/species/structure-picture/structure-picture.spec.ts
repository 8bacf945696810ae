import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import { displayWidth, STRUCTURE_DRAWER, StructurePicture, svgDataUrl } from './structure-picture';

@Component({
  imports: [StructurePicture],
  template: `<thalpos-structure-picture [smiles]="smiles()" name="2-methylpropane" />`,
})
class Host {
  readonly smiles = signal('CC(C)C');
}

describe('StructurePicture', () => {
  const settle = async (fixture: { whenStable(): Promise<unknown> }) => {
    await fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  };

  function setUp(draw: (smiles: string) => Promise<string>) {
    TestBed.configureTestingModule({ providers: [{ provide: STRUCTURE_DRAWER, useValue: draw }] });
    const fixture = TestBed.createComponent(Host);
    return { fixture, element: fixture.nativeElement as HTMLElement };
  }

  it('shows the drawing of the SMILES as an image with a text alternative', async () => {
    const draw = jest.fn((smiles: string) => Promise.resolve(`<svg><text>${smiles}</text></svg>`));
    const { fixture, element } = setUp(draw);
    await settle(fixture);

    expect(draw).toHaveBeenCalledWith('CC(C)C');
    const img = element.querySelector('img')!;
    expect(img.getAttribute('src')).toBe(svgDataUrl('<svg><text>CC(C)C</text></svg>'));
    expect(img.getAttribute('alt')).toBe('Structure of 2-methylpropane (CC(C)C)');
  });

  it('redraws when the SMILES changes and says so when a SMILES cannot be drawn', async () => {
    const draw = jest.fn((smiles: string) =>
      smiles === 'C1CC' ? Promise.reject(new Error('unclosed ring')) : Promise.resolve('<svg/>'),
    );
    const { fixture, element } = setUp(draw);
    await settle(fixture);
    fixture.componentInstance.smiles.set('C1CC');
    await settle(fixture);

    expect(draw).toHaveBeenLastCalledWith('C1CC');
    expect(element.querySelector('img')).toBeNull();
    expect(element.textContent).toContain('the SMILES C1CC could not be drawn');
  });

  it('encodes the SVG so that any character survives in the address', () => {
    const url = svgDataUrl('<svg><text>#1 & 50%</text></svg>');
    expect(url.startsWith('data:image/svg+xml;charset=utf-8,')).toBe(true);
    expect(decodeURIComponent(url.split(',')[1])).toBe('<svg><text>#1 & 50%</text></svg>');
  });

  it('enlarges small drawings up to 2.5× and fits large ones into the box', () => {
    const svg = (w: number, h: number) =>
      `<svg id="s" xmlns="http://www.w3.org/2000/svg" width="${w}px" height="${h}px" viewBox="0 0 ${w} ${h}">`;
    expect(displayWidth(svg(57, 45))).toBe(143);
    expect(displayWidth(svg(174, 41))).toBe(280);
    expect(displayWidth(svg(100, 360))).toBe(50);
    expect(displayWidth('<svg/>')).toBeNull();
  });
});
