import {
  ChangeDetectionStrategy,
  Component,
  effect,
  inject,
  InjectionToken,
  input,
  signal,
} from '@angular/core';

/** Draws a SMILES string as SVG text; rejects what it cannot read. */
export type StructureDrawer = (smiles: string) => Promise<string>;

/**
 * openchemlib, loaded on first use only: it is large, ESM-only and needs no eval, so it runs
 * under the app's strict Content-Security-Policy (and never inside the Jest specs, which
 * provide a drawer of their own).
 */
export const STRUCTURE_DRAWER = new InjectionToken<StructureDrawer>('STRUCTURE_DRAWER', {
  providedIn: 'root',
  factory: () => async (smiles) => {
    const { Molecule } = await import('openchemlib');
    const molecule = Molecule.fromSmiles(smiles);
    return molecule.toSVG(320, 220, 'structure', { suppressChiralText: true });
  },
});

type Picture =
  | { readonly state: 'drawing' }
  | { readonly state: 'drawn'; readonly src: string }
  | { readonly state: 'failed' };

/** A structure picture drawn in the browser from SMILES; the SVG is shown as an image. */
@Component({
  selector: 'thalpos-structure-picture',
  template: `
    @let p = picture();
    @switch (p.state) {
      @case ('drawn') {
        <img [src]="p.src" [alt]="'Structure of ' + name() + ' (' + smiles() + ')'" />
      }
      @case ('failed') {
        <p class="note">No picture: the SMILES {{ smiles() }} could not be drawn.</p>
      }
      @default {
        <p class="note">Drawing the structure…</p>
      }
    }
  `,
  styles: `
    :host {
      display: flex;
      justify-content: center;
      align-items: center;
      min-height: 160px;
      padding: 8px;
      border-radius: var(--mat-sys-corner-medium);
      // The drawing uses black strokes: keep a light ground in dark mode too.
      background: #ffffff;
      color: #1f1b16;
    }
    img {
      max-width: 100%;
      height: auto;
    }
    .note {
      margin: 0;
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StructurePicture {
  private readonly draw = inject(STRUCTURE_DRAWER);

  readonly smiles = input.required<string>();
  /** The species' name, for the picture's text alternative. */
  readonly name = input.required<string>();

  protected readonly picture = signal<Picture>({ state: 'drawing' });

  constructor() {
    effect((onCleanup) => {
      const smiles = this.smiles();
      let current = true;
      onCleanup(() => (current = false));
      this.picture.set({ state: 'drawing' });
      this.draw(smiles).then(
        (svg) => {
          if (current) this.picture.set({ state: 'drawn', src: svgDataUrl(svg) });
        },
        () => {
          if (current) this.picture.set({ state: 'failed' });
        },
      );
    });
  }
}

/** An SVG document as a `data:` address (allowed by the policy's `img-src`). */
export function svgDataUrl(svg: string): string {
  return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
}
