import type { ReleaseRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { enqueueMail, type OutgoingMail } from '../mail/outbox';
import { notificationsRepository } from '../notifications/notifications-repository';
import { watchlistImpactsForRelease, type WatcherReport } from '../watchlists/watchlist-impacts';
import type { ImpactSide } from '../watchlists/watchlists-schemas';
import { watchlistsRepository } from '../watchlists/watchlists-repository';
import { draftRepository } from './draft-repository';
import { createReleasesService, type OnPublished } from './releases-service';

const signed = (x: number) => `${x < 0 ? '−' : x > 0 ? '+' : ''}${Math.abs(x).toFixed(2)}`;
const plain = (x: number) => `${x < 0 ? '−' : ''}${Math.abs(x).toFixed(2)}`;
const BASIS: Record<string, string> = {
  standard: 'standard uncertainty',
  expanded_k2: 'expanded, k = 2',
  as_stated: 'as stated',
  mixed: 'mixed bases',
};

/** One release's ΔrH of a watched reaction, as a line of the e-mail. */
function sideLine(version: string, s: ImpactSide, unit: string): string {
  if ('error' in s) return `  ${version}: cannot be computed: ${s.error.message}`;
  const u =
    s.uncertainty === null
      ? ''
      : ` ± ${s.uncertainty.toFixed(2)} (${BASIS[s.uncertaintyBasis] ?? s.uncertaintyBasis})`;
  return `  ${version}: ΔrH = ${plain(s.deltaH)}${u} ${unit}`;
}

/** The plain-text impact e-mail of one watchlist for a newly published release. Pure. */
export function releaseImpactMail(r: WatcherReport, publicUrl: string): Omit<OutgoingMail, 'to'> {
  const { report, watchlist } = r;
  const lines = report.results.map((item) => {
    const name = item.label ? `${item.label}: ${item.input}` : item.input;
    const head = `- ${name} (at ${item.temperatureK} K)`;
    const sides = [
      sideLine(report.from, item.from, report.unit),
      sideLine(report.to, item.to, report.unit),
    ];
    if (item.change === null) return [head, ...sides].join('\n');
    const combined =
      item.combinedUncertainty === null
        ? ''
        : ` (combined uncertainty ${item.combinedUncertainty.toFixed(2)})`;
    const flag = item.exceedsUncertainty ? '  ← beyond the combined uncertainty' : '';
    return [
      head,
      ...sides,
      `  change ${signed(item.change)} ${report.unit}${combined}${flag}`,
    ].join('\n');
  });
  const summary =
    report.exceeding > 0
      ? `${report.exceeding} of ${report.count} reactions changed by more than their combined uncertainty.`
      : `None of the ${report.count} reactions changed by more than its combined uncertainty.`;
  return {
    subject: `Release ${report.to} published — impact on your watchlist “${watchlist.name}”`,
    text:
      `Thalpos release ${report.to} is published. Reaction enthalpies of your watchlist ` +
      `“${watchlist.name}” at its temperatures, ${report.from} → ${report.to}:\n\n` +
      `${summary}\n\n${lines.join('\n')}\n\n` +
      `Compare the releases: ${publicUrl}/releases/${report.from}/diff/${report.to}\n\n` +
      `${report.caution}\n\n` +
      `You get this because you keep this watchlist; turn release e-mails off in your settings.`,
    eventKind: 'release.published',
    recipientId: r.owner.id,
  };
}

/**
 * In the publish transaction: every watcher who wants e-mail gets the impact report of each of
 * their watchlists between the base release and the new one, through the outbox (so the mail
 * commits with the release or not at all). The reports read the new release inside the same
 * transaction, where it is already frozen.
 */
export function watcherMailsOnPublish(publicUrl: string): OnPublished {
  return async (tx: Tx, release: ReleaseRow) => {
    if (!release.baseReleaseId) return;
    // Computing two releases' snapshots is the costly part: skip it when nobody watches.
    if ((await watchlistsRepository.withOwners(tx)).length === 0) return;
    const base = await draftRepository.findById(tx, release.baseReleaseId);
    if (!base) return;
    const inTx = tx as unknown as Database;
    const reports = await watchlistImpactsForRelease(
      inTx,
      base.version,
      release.version,
      createReleasesService(inTx),
    );
    if (reports.length === 0) return;
    const wanting = await notificationsRepository.recipients(tx, {
      ids: [...new Set(reports.map((r) => r.owner.id))],
      exceptId: -1,
    });
    const address = new Map(wanting.map((w) => [w.id, w.email]));
    await enqueueMail(
      tx,
      reports
        .filter((r) => address.has(r.owner.id))
        .map((r) => ({ ...releaseImpactMail(r, publicUrl), to: address.get(r.owner.id)! })),
    );
  };
}
