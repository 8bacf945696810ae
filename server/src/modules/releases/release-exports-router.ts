import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';
import { Router } from 'express';
import { stringify } from 'csv-stringify/sync';
import { z } from 'zod';
import { guardCsvText } from '../../lib/csv-text';
import { validate } from '../../middleware/validate';
import { IMMUTABLE_CACHE, LATEST_CACHE, sendReleaseAnswer } from './release-http-cache';
import { EXPORT_CONTENT_TYPES, type ExportFormat } from './release-export-writers';
import type { ReleaseExportsService } from './release-exports-service';
import {
  DiffParams,
  DiffQuery,
  ExportParams,
  ReleaseDiffRow,
  ReleaseExport,
  type ReleaseDiff,
} from './releases-schemas';
import { LATEST, type ReleasesService } from './releases-service';

/** The JSON Schema of the JSON export, generated once from its zod contract. */
const EXPORT_JSON_SCHEMA = JSON.stringify({
  $id: '/api/v1/schemas/release-export.json',
  ...z.toJSONSchema(ReleaseExport, { target: 'draft-2020-12' }),
});

export const exportUrl = (base: string, version: string, format: ExportFormat) =>
  `${base}/releases/${encodeURIComponent(version)}/export.${format}`;

/** Raised by a stream sink when the client has gone: the cursor's transaction rolls back. */
class ClientGone extends Error {}

/** Writes to the response, waiting whenever the client reads slower than the database. */
function responseSink(res: Response) {
  return (chunk: Buffer) => {
    if (res.destroyed) throw new ClientGone();
    if (res.write(chunk)) return;
    return new Promise<void>((resolve, reject) => {
      const drained = () => {
        res.off('close', gone);
        resolve();
      };
      const gone = () => {
        res.off('drain', drained);
        reject(new ClientGone());
      };
      res.once('drain', drained);
      res.once('close', gone);
    });
  };
}

const snake = (key: string) => key.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
const DIFF_KEYS = Object.keys(ReleaseDiffRow.shape) as (keyof ReleaseDiffRow)[];

/** Fields of numbers, whose leading '-' is a sign; every other field is text, guarded. */
const DIFF_NUMBERS: ReadonlySet<keyof ReleaseDiffRow> = new Set([
  'oldRevisionId',
  'newRevisionId',
  'oldValue',
  'newValue',
  'oldUncertainty',
  'newUncertainty',
  'differenceKjPerMol',
  'combinedUncertaintyKjPerMol',
  'differenceInUncertainties',
] as const);

const diffCell = (r: ReleaseDiffRow, k: keyof ReleaseDiffRow) => {
  const v = r[k];
  return DIFF_NUMBERS.has(k) || typeof v !== 'string' ? v : guardCsvText(v);
};

/**
 * The diff as CSV: one row per JSON row, the same fields in the same order, snake_case headers;
 * text cells guarded against running as spreadsheet formulas.
 */
export function diffCsv(diff: ReleaseDiff): string {
  return stringify(
    [DIFF_KEYS.map(snake), ...diff.rows.map((r) => DIFF_KEYS.map((k) => diffCell(r, k)))],
    { record_delimiter: '\n' },
  );
}

export function releaseExportsRouter(
  releases: ReleasesService,
  exportsService: ReleaseExportsService,
): Router {
  const router = Router();

  router.get('/schemas/release-export.json', (_req, res) => {
    res.setHeader('Cache-Control', 'public, max-age=3600');
    res.type('application/schema+json').send(EXPORT_JSON_SCHEMA);
  });

  const exportRoute = validate({ params: ExportParams });
  router.get('/releases/:version/export.:format', exportRoute, async (req, res) => {
    const { version, format } = exportRoute.input(res).params;
    const release = await releases.resolve(version);
    if (version === LATEST) {
      // The current version's own URL, whose answer is then cacheable for good.
      res.setHeader('Cache-Control', LATEST_CACHE);
      res.redirect(302, exportUrl(req.baseUrl, release.version, format));
      return;
    }
    const digest = await exportsService.digestOf(release, format);
    res.setHeader('ETag', `"${digest.sha256}"`);
    res.setHeader('Cache-Control', IMMUTABLE_CACHE);
    res.setHeader('Content-Type', EXPORT_CONTENT_TYPES[format]);
    res.setHeader(
      'Content-Disposition',
      `attachment; filename="thalpos-${release.version}.${format}"`,
    );
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    // The stored size: a download shows its progress, and HEAD answers without reading the bytes.
    res.setHeader('Content-Length', digest.bytes);
    if (req.method === 'HEAD') {
      res.end();
      return;
    }
    await streamExport(req, res, () => exportsService.write(release, format, responseSink(res)));
  });

  const diffRoute = validate({ params: DiffParams, query: DiffQuery });
  router.get('/releases/:a/diff/:b', diffRoute, async (req, res) => {
    const { params, query } = diffRoute.input(res);
    const suffix = /\.(csv|json)$/.exec(params.b);
    const to = suffix ? params.b.slice(0, suffix.index) : params.b;
    const format = suffix?.[1] ?? query.format ?? 'json';
    const diff = await exportsService.diff(params.a, to);
    const moving = params.a === LATEST || to === LATEST ? LATEST : diff.to;
    if (format === 'json') {
      sendReleaseAnswer(req, res, diff, moving);
      return;
    }
    const csv = Buffer.from(diffCsv(diff), 'utf8');
    res.setHeader('Cache-Control', moving === LATEST ? LATEST_CACHE : IMMUTABLE_CACHE);
    res.setHeader(
      'Content-Disposition',
      `attachment; filename="thalpos-diff-${diff.from}-${diff.to}.csv"`,
    );
    res.setHeader('ETag', `"${createHash('sha256').update(csv).digest('hex')}"`);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.send(csv);
  });

  return router;
}

/** Runs a streamed answer; once bytes are out, a failure can only cut the connection. */
async function streamExport(req: Request, res: Response, run: () => Promise<void>) {
  try {
    await run();
    res.end();
  } catch (err) {
    if (err instanceof ClientGone) return;
    if (!res.headersSent) throw err;
    req.log?.error({ err }, 'export stream failed');
    res.destroy(err as Error);
  }
}
