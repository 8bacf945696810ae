// Browser tests drive a real build on a shared machine: a test may take tens of seconds when the
// machine is busy. Every wait in them waits for a condition, so this is only an upper bound.
// (Jest reads `testTimeout` from the global config only, not from a project, hence this file.)
jest.setTimeout(120_000);
