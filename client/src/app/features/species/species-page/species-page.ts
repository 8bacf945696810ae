import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import type { SpeciesPage as SpeciesAnswer } from '@contracts/species/species-schemas';
import { ApiError, readableMessage } from '../../../core/api-error';
import { ReleaseContext } from '../../../core/release-context';
import { ChemText } from '../../../shared/chem-text';
import { phaseLabel, phaseName } from '../../../shared/phase-name';
import { SpeciesApi } from '../species-api';
import {
  basisWords,
  kjFromJoules,
  kjUncertainty,
  molarMassText,
  staleWords,
} from '../species-format';
import { StructurePicture } from '../structure-picture/structure-picture';
import { ReleaseValues } from './release-values/release-values';
import { RevisionHistory } from './revision-history/revision-history';

type Loaded =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly species: SpeciesAnswer }
  | { readonly state: 'missing'; readonly key: string }
  | { readonly state: 'failed'; readonly message: string };

/** Species: identity, structure, phases with their values per release, revisions, sources. */
@Component({
  selector: 'thalpos-species-page',
  imports: [
    RouterLink,
    MatIcon,
    MatProgressBar,
    ChemText,
    StructurePicture,
    ReleaseValues,
    RevisionHistory,
  ],
  templateUrl: './species-page.html',
  styleUrl: './species-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeciesPage {
  private readonly api = inject(SpeciesApi);
  protected readonly context = inject(ReleaseContext);

  /** The registry key from the route (`/species/:key`). */
  readonly key = input.required<string>();

  protected readonly loaded = toSignal(
    toObservable(this.key).pipe(
      switchMap((key) =>
        this.api.species(key).pipe(
          map((species): Loaded => ({ state: 'loaded', species })),
          catchError((error: unknown) =>
            of<Loaded>(
              error instanceof ApiError && error.status === 404
                ? { state: 'missing', key }
                : { state: 'failed', message: readableMessage(error) },
            ),
          ),
          startWith<Loaded>({ state: 'loading' }),
        ),
      ),
    ),
    { initialValue: { state: 'loading' } as Loaded },
  );

  protected readonly species = computed(() => {
    const loaded = this.loaded();
    return loaded.state === 'loaded' ? loaded.species : null;
  });

  /** Each phase with its ΔfH° in the release the screens are pinned to. */
  protected readonly phases = computed(() => {
    const species = this.species();
    if (!species) return [];
    const release = this.context.effective();
    const revisions = new Map(species.revisions.map((r) => [r.id, r]));
    return species.phases.map((p) => {
      const inRelease = p.formationEnthalpy.find((v) => v.release === release) ?? null;
      const revision = inRelease ? revisions.get(inRelease.revisionId) : undefined;
      return {
        id: `${p.phase}-${p.modification ?? ''}`,
        label: species.formula + phaseLabel(p.phase, p.modification),
        name: phaseName(p.phase, p.modification),
        value: inRelease ? kjFromJoules(inRelease.value) : null,
        spread: inRelease ? kjUncertainty(inRelease.uncertainty) : null,
        basis: inRelease ? basisWords(inRelease.uncertaintyBasis) : '',
        revisionId: inRelease?.revisionId ?? null,
        derived: revision?.derived === true,
        staleNotices: revision?.stale ? staleWords(revision.staleInputs) : [],
      };
    });
  });

  protected readonly molarMass = computed(() => {
    const species = this.species();
    return species ? molarMassText(species.molarMass) : '';
  });

  protected readonly sources = computed(() => this.species()?.sources ?? []);
}
