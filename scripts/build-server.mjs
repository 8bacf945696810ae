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

// The local sign-in stand-in is development code (its oauth2-mock-server is a development
// dependency): main.js only loads the separate github-fake.js when asked to (FAKE_SIGN_IN).
const fakeApart = {
  name: 'fake-github-apart',
  setup(b) {
    b.onResolve({ filter: /\/fakes\/github-fake$/ }, () => ({
      path: './github-fake.js',
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
