// Production build of the server: one bundle, dependencies left in node_modules.
// `node scripts/build-server.mjs [outdir]` (default dist/server).
import { build } from 'esbuild';

const outdir = process.argv[2] ?? 'dist/server';
const common = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  packages: 'external',
  sourcemap: true,
};

// The local stand-ins are development code (oauth2-mock-server, smtp-server and mailparser are
// development dependencies): main.js only loads the separate github-fake.js when asked to
// (FAKE_SIGN_IN), and smtp-fake.js never in production.
const fakeApart = {
  name: 'fakes-apart',
  setup(b) {
    b.onResolve({ filter: /\/fakes\/(github|smtp|doi|s3)-fake$/ }, (args) => ({
      path: `./${args.path.split('/').pop()}.js`,
      external: true,
    }));
  },
};

await build({
  ...common,
  entryPoints: ['server/src/main.ts'],
  outfile: `${outdir}/main.js`,
  plugins: [fakeApart],
});
await build({
  ...common,
  entryPoints: ['server/src/fakes/github-fake.ts'],
  outfile: `${outdir}/github-fake.js`,
});
await build({
  ...common,
  entryPoints: ['server/src/fakes/smtp-fake.ts'],
  outfile: `${outdir}/smtp-fake.js`,
});
await build({
  ...common,
  entryPoints: ['server/src/fakes/doi-fake.ts'],
  outfile: `${outdir}/doi-fake.js`,
});
await build({
  ...common,
  entryPoints: ['server/src/fakes/s3-fake.ts'],
  outfile: `${outdir}/s3-fake.js`,
});
