import type { StoredPhase } from '../../../../schema';
import type { Database } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { molarMass, parseFormula } from '../../thermo';
import type { ReleasesService } from '../releases/releases-service';
import { registryRepository, type StaleInputRow } from '../proposals/registry-repository';
import { speciesRepository } from './species-repository';
import type {
  ReleaseSpeciesPage,
  ReleaseSpeciesQuery,
  RevisionView,
  SpeciesPage,
} from './species-schemas';

/** Revisions a reader sees: proposals and rejected ones belong to the curation screens. */
const PUBLIC_STATUSES = ['accepted', 'superseded', 'retired'] as const;

const num = (t: string | null): number | null => (t === null ? null : Number(t));

export const unknownSpecies = (key: string) =>
  new AppError(404, 'unknown_species', `There is no species with key ${JSON.stringify(key)}`, {
    key,
  });

/** Derived values say whether an input was superseded since (and by what). */
function derivedFields(id: number, staleRows: StaleInputRow[]) {
  const staleInputs = staleRows
    .filter((s) => s.revisionId === id)
    .map(({ revisionId: _r, ...s }) => s);
  return { derived: true, stale: staleInputs.length > 0, staleInputs };
}

export function createSpeciesService(db: Database, releases: ReleasesService) {
  return {
    async listInRelease(version: string, q: ReleaseSpeciesQuery): Promise<ReleaseSpeciesPage> {
      const release = await releases.resolve(version);
      // Any spelling of a formula compares in Hill order (OH2 → H2O); a bad one is a 400 from the engine.
      const formula = q.formula === undefined ? undefined : parseFormula(q.formula).hill;
      const phases: StoredPhase[] | undefined =
        q.phase === undefined ? undefined : q.phase === 's' ? ['cr', 'am'] : [q.phase];
      const rows = await speciesRepository.listInRelease(db, release.id, {
        formula,
        phases,
        name: q.name,
        sort: q.sort,
        order: q.order,
        limit: q.pageSize,
        offset: (q.page - 1) * q.pageSize,
      });
      return {
        release: release.version,
        page: q.page,
        pageSize: q.pageSize,
        total: rows[0]?.total ?? 0,
        formula: formula ?? null,
        items: rows.map((r) => ({
          key: r.key,
          name: r.name,
          formula: r.formula,
          charge: r.charge,
          phase: r.phase,
          modification: r.modification,
          deltaFH: Number(r.value),
          deltaFHText: r.value!,
          uncertainty: num(r.uncertainty),
          uncertaintyBasis: r.uncertaintyBasis,
          method: r.method,
          standardPressure: r.standardPressure,
          fromMemory: r.fromMemory,
          revisionId: r.revisionId,
          source: { id: r.sourceId, citation: r.citation, doi: r.doi },
        })),
      };
    },

    async page(key: string): Promise<SpeciesPage> {
      const s = await speciesRepository.findByKey(db, key);
      if (!s) throw unknownSpecies(key);
      const [phases, revisionRows, pins] = await Promise.all([
        speciesRepository.phasesOf(db, s.id),
        speciesRepository.revisionsOf(db, s.id, PUBLIC_STATUSES),
        speciesRepository.pinsOf(db, s.id),
      ]);
      const heatIds = revisionRows
        .filter((r) => r.revision.kind === 'heat_capacity')
        .map((r) => r.revision.id);
      const [ranges, sourceRows] = await Promise.all([
        speciesRepository.rangesOf(db, heatIds),
        speciesRepository.sourcesByIds(db, [
          ...new Set(revisionRows.map((r) => r.revision.sourceId)),
        ]),
      ]);

      const pinnedBy = new Map<number, string[]>();
      for (const p of pins) {
        const list = pinnedBy.get(p.revisionId);
        if (list) list.push(p.version);
        else pinnedBy.set(p.revisionId, [p.version]);
      }
      const revisionById = new Map(revisionRows.map((r) => [r.revision.id, r.revision]));
      const staleRows = await registryRepository.staleInputsOfRevisions(
        db,
        revisionRows.filter((r) => r.revision.derivation !== null).map((r) => r.revision.id),
      );

      const revisions: RevisionView[] = revisionRows.map(({ revision: r, phase, modification }) => {
        const own = ranges.filter((x) => x.revisionId === r.id);
        return {
          id: r.id,
          phase,
          modification,
          kind: r.kind,
          quantity: r.quantity,
          value: num(r.value),
          valueText: r.value,
          uncertainty: num(r.uncertainty),
          uncertaintyBasis: r.uncertaintyBasis,
          temperature: num(r.temperature),
          toPhase: r.toPhase,
          toModification: r.toModification,
          heatCapacity: r.heatCapacityForm
            ? {
                form: r.heatCapacityForm,
                ranges: own.map((x) => ({
                  tMin: Number(x.tMin),
                  tMax: Number(x.tMax),
                  coefficients: x.coefficients.map((c) => num(c)),
                })),
              }
            : null,
          method: r.method,
          standardPressure: r.standardPressure,
          sourceId: r.sourceId,
          notes: r.notes,
          fromMemory: r.fromMemory,
          status: r.status,
          supersedesId: r.supersedesId,
          createdAt: r.createdAt.toISOString(),
          releases: pinnedBy.get(r.id) ?? [],
          ...(r.derivation !== null ? derivedFields(r.id, staleRows) : {}),
        };
      });

      return {
        key: s.key,
        name: s.name,
        synonyms: s.synonyms,
        formula: s.formula,
        charge: s.charge,
        casRn: s.casRn,
        inchi: s.inchi,
        inchiKey: s.inchiKey,
        smiles: s.smiles,
        notes: s.notes,
        molarMass: molarMass(s.formula),
        phases: phases.map((p) => ({
          phase: p.phase,
          modification: p.modification,
          formationEnthalpy: pins
            .filter((pin) => pin.speciesPhaseId === p.id && pin.quantity === 'formation_enthalpy')
            .map((pin) => {
              const r = revisionById.get(pin.revisionId)!;
              return {
                release: pin.version,
                publishedAt: pin.publishedAt!.toISOString(),
                revisionId: r.id,
                value: Number(r.value),
                uncertainty: num(r.uncertainty),
                uncertaintyBasis: r.uncertaintyBasis,
              };
            }),
        })),
        revisions,
        sources: sourceRows.map((x) => ({
          id: x.id,
          citation: x.citation,
          doi: x.doi,
          csl: x.csl,
        })),
      };
    },
  };
}

export type SpeciesService = ReturnType<typeof createSpeciesService>;
