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
    // Cropped to the molecule; the picture is then scaled to the box, small molecules too.
    return molecule.toSVG(320, 220, 'structure', {
      suppressChiralText: true,
      autoCrop: true,
      autoCropMargin: 12,
    });
  },
});

type Picture =
  | { readonly state: 'drawing' }
  | { readonly state: 'drawn'; readonly src: string; readonly width: number | null }
  | { readonly state: 'failed' };

/** A structure picture drawn in the browser from SMILES; the SVG is shown as an image. */
@Component({
  selector: 'thalpos-structure-picture',
  template: `
    @let p = picture();
    @switch (p.state) {
      @case ('drawn') {
        <img
          [src]="p.src"
          [style.width.px]="p.width"
          [alt]="'Structure of ' + name() + ' (' + smiles() + ')'"
        />
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
          if (current) {
            this.picture.set({ state: 'drawn', src: svgDataUrl(svg), width: displayWidth(svg) });
          }
        },
        () => {
          if (current) this.picture.set({ state: 'failed' });
        },
      );
    });
  }
}

/**
 * How wide to show a cropped drawing: enlarged up to 2.5× (a lone atom stays a modest label),
 * within 280 × 180 px. Null when the SVG states no size.
 */
export function displayWidth(svg: string): number | null {
  const size = /<svg[^>]*\swidth="([\d.]+)(?:px)?"[^>]*\sheight="([\d.]+)(?:px)?"/.exec(svg);
  if (!size) return null;
  const [width, height] = [Number(size[1]), Number(size[2])];
  if (!(width > 0 && height > 0)) return null;
  return Math.round(width * Math.min(2.5, 280 / width, 180 / height));
}

/** An SVG document as a `data:` address (allowed by the policy's `img-src`). */
export function svgDataUrl(svg: string): string {
  return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
}
