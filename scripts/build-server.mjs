// Production build of the server: one bundle, dependencies left in node_modules.
import { build } from 'esbuild';

await build({
  entryPoints: ['server/src/main.ts'],
  outfile: 'dist/server/main.js',
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  packages: 'external',
  sourcemap: true,
});
