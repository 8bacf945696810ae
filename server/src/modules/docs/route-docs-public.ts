import { HessAnswer, ParseAnswer } from '../calculate/calculate-schemas';
import { BatchAnswer, ReactionAnswer } from '../reactions/reactions-schemas';
import { ReleaseDiff, ReleaseList, ReleaseManifestWithExports } from '../releases/releases-schemas';
import { SearchAnswer } from '../search/search-schemas';
import { SourceDetail, SourceList } from '../sources/sources-schemas';
import { ReleaseSpeciesPage, SpeciesPage } from '../species/species-schemas';
import { ImpactAnswer } from '../watchlists/watchlists-schemas';
import { file, none, routeGroup, type RouteDoc } from './route-doc-types';

/** Routes open to anyone: reading releases and species, calculating, the reference itself. */
export const PUBLIC_ROUTE_DOCS: Record<string, RouteDoc> = {
  ...routeGroup('Service', 'public', {
    'GET /api/health': {
      summary: 'Liveness and database reachability',
      answers: { 200: file('application/json', '{"status":"ok","db":"ok"}') },
      example: {},
    },
    'GET /api/v1/openapi.json': {
      summary: 'This API reference as OpenAPI 3.1',
      answers: { 200: file('application/json', 'the OpenAPI document') },
      example: {},
    },
    'GET /api/docs': {
      summary: 'The API reference page (at /api/docs/)',
      answers: { 200: file('text/html', 'the reference page'), 301: none },
    },
  }),
  ...routeGroup('Reaction enthalpy', 'public', {
    'POST /api/v1/reaction-enthalpy': {
      summary: 'ΔrH of one reaction against a published release, with per-term provenance',
      answers: { 200: ReactionAnswer },
      example: { body: { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', release: '2026.1' } },
    },
    'GET /api/v1/reaction-enthalpy': {
      summary: 'The same as the POST form, from query parameters (a link reproduces it)',
      answers: { 200: ReactionAnswer, 304: none },
      example: {
        query: {
          equation: 'CaCO3(calcite) -> CaO(cr) + CO2(g)',
          release: '2026.1',
          unit: 'kJ/mol',
        },
      },
    },
    'POST /api/v1/reaction-enthalpy/batch': {
      summary: 'Up to 10,000 reactions in one request; a result or an error per item, in order',
      answers: { 200: BatchAnswer },
      example: {
        body: {
          release: '2026.1',
          reactions: [
            { id: 'burner', equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', temperatureK: 1000 },
            { id: 'shift', equation: 'CO(g) + H2O(g) -> CO2(g) + H2(g)' },
          ],
        },
      },
    },
  }),
  ...routeGroup('Calculation', 'public', {
    'POST /api/v1/equations/parse': {
      summary: 'Parse an equation: species, phases, balance and a balancing suggestion',
      answers: { 200: ParseAnswer },
      example: { body: { equation: 'C3H8(g) + O2(g) -> CO2(g) + H2O(l)' } },
    },
    'POST /api/v1/hess/solve': {
      summary: "Hess's law: combine given steps into a target reaction",
      answers: { 200: HessAnswer },
      example: {
        body: {
          target: 'C(graphite) + 1/2 O2(g) -> CO(g)',
          steps: [
            { equation: 'C(graphite) + O2(g) -> CO2(g)', deltaH: -393.51 },
            { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -282.98 },
          ],
          unit: 'kJ/mol',
        },
      },
    },
  }),
  ...routeGroup('Releases', 'public', {
    'GET /api/v1/releases': {
      summary: 'Published releases, newest first',
      answers: { 200: ReleaseList },
      example: {},
    },
    'GET /api/v1/releases/:version': {
      summary: "A release's manifest: counts, notes, who published it and when, export checksums",
      answers: { 200: ReleaseManifestWithExports, 304: none },
      example: { path: { version: 'latest' } },
    },
    'GET /api/v1/releases/:version/species': {
      summary: 'The species-phases of a release; paged, filter by formula, phase or name',
      answers: { 200: ReleaseSpeciesPage, 304: none },
      example: { path: { version: '2026.1' }, query: { phase: 'g', name: 'meth' } },
    },
    'GET /api/v1/releases/:a/diff/:b': {
      summary:
        'Values added, removed and changed between two releases (JSON, or CSV with format=csv)',
      answers: { 200: ReleaseDiff },
      example: { path: { a: '2026.1', b: 'latest' } },
    },
    'POST /api/v1/releases/:a/impact/:b': {
      summary: 'ΔrH of a list of reactions (or a watchlist) in two releases, and the change',
      answers: { 200: ImpactAnswer },
      example: {
        path: { a: '2026.1', b: 'latest' },
        body: { equations: ['CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)'] },
      },
    },
  }),
  ...routeGroup('Exports', 'public', {
    'GET /api/v1/releases/:version/export.:format': {
      summary: 'A whole release as CSV, JSON or XML; byte-stable, SHA-256 in the manifest',
      answers: {
        200: file('text/csv', 'the export (text/csv, application/json or application/xml)'),
        302: none,
        304: none,
      },
      example: { path: { version: '2026.1', format: 'csv' } },
    },
    'GET /api/v1/schemas/release-export.json': {
      summary: 'JSON Schema of the JSON export',
      answers: { 200: file('application/schema+json', 'a JSON Schema') },
      example: {},
    },
  }),
  ...routeGroup('Species', 'public', {
    'GET /api/v1/species/:key': {
      summary:
        'A species: phases, its value in each release, revision history, sources, molar mass',
      answers: { 200: SpeciesPage },
      example: { path: { key: 'carbon-dioxide' } },
    },
    'GET /api/v1/search': {
      summary: 'Find species by name, synonym, formula, CAS RN or InChIKey; tolerant of typos',
      answers: { 200: SearchAnswer },
      example: { query: { q: 'metanol' } },
    },
  }),
  ...routeGroup('Sources', 'public', {
    'GET /api/v1/sources': {
      summary: 'Sources, searchable by text',
      answers: { 200: SourceList },
      example: { query: { q: 'CODATA' } },
    },
    'GET /api/v1/sources/:id': {
      summary: 'One source with its formatted citation',
      answers: { 200: SourceDetail },
    },
    'GET /api/v1/sources/:id.bib': {
      summary: 'One source as BibTeX',
      answers: { 200: file('application/x-bibtex', 'BibTeX') },
    },
    'GET /api/v1/sources/:id.ris': {
      summary: 'One source as RIS',
      answers: { 200: file('application/x-research-info-systems', 'RIS') },
    },
  }),
};
