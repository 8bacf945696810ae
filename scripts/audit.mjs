// npm run audit: lists known advisories for the installed dependency tree, from the registry's
// advisory endpoint. Where that endpoint cannot be reached it says so plainly: no answer is
// not a clean bill of health. Exit code: 0 none found, 1 advisories found, 2 not checked.
import { spawnSync } from 'node:child_process';

const run = spawnSync('npm', ['audit', '--json'], { encoding: 'utf8', timeout: 120_000 });
const registry =
  spawnSync('npm', ['config', 'get', 'registry'], { encoding: 'utf8' }).stdout.trim() ||
  'the npm registry';

let report;
try {
  report = JSON.parse(run.stdout);
} catch {
  report = null;
}

if (!report || report.error || !report.metadata) {
  const why =
    report?.message ||
    report?.error?.summary ||
    report?.error?.code ||
    run.stderr?.trim() ||
    (run.error ? String(run.error) : 'no answer');
  console.log(
    `NOT CHECKED: the advisory endpoint of ${registry} could not be queried (${why.split('\n')[0]}).\n` +
      'No advisories were looked up, so this is not a clean result. Run `npm run audit` again ' +
      'where the registry is reachable.',
  );
  process.exit(2);
}

const vulns = Object.values(report.vulnerabilities ?? {});
const counts = report.metadata.vulnerabilities;
console.log(
  `Advisories from ${registry} for ${report.metadata.dependencies?.total ?? '?'} packages: ` +
    `${counts.total} vulnerable (critical ${counts.critical}, high ${counts.high}, ` +
    `moderate ${counts.moderate}, low ${counts.low}).`,
);
for (const v of vulns) {
  const advisories = v.via.filter((a) => typeof a === 'object').map((a) => `${a.title} (${a.url})`);
  const through = v.via.filter((a) => typeof a === 'string');
  console.log(
    `- ${v.name} ${v.range} [${v.severity}]${v.isDirect ? ' direct' : ''}: ` +
      (advisories.length ? advisories.join('; ') : `through ${through.join(', ')}`) +
      (v.fixAvailable ? '; a fix is available' : '; no fix yet'),
  );
}
process.exit(counts.total > 0 ? 1 : 0);
