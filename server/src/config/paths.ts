import fs from 'node:fs';
import path from 'node:path';

/** The repository root, found from this file whether it runs from source or from the bundle. */
function findProjectRoot(start: string): string {
  for (let dir = start; ; dir = path.dirname(dir)) {
    if (fs.existsSync(path.join(dir, 'package.json')) && fs.existsSync(path.join(dir, 'schema')))
      return dir;
    if (path.dirname(dir) === dir)
      throw new Error(`Cannot find the Thalpos project root above ${start}`);
  }
}

export const PROJECT_ROOT = findProjectRoot(__dirname);
export const MIGRATIONS_FOLDER = path.join(PROJECT_ROOT, 'schema/migrations');
export const DEFAULT_CLIENT_DIST = path.join(PROJECT_ROOT, 'dist/client/browser');
