import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv({
  errorOnUnknownElements: true,
  errorOnUnknownProperties: true,
});

// Rendering specs share the machine with the rest of the run; on a busy moment one may take
// several times its usual second. Their waits are for conditions, so this is only an upper bound.
jest.setTimeout(30_000);
