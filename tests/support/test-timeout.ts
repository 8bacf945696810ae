// Property runs, database clones and real queries share the machine with the rest of the run: a
// busy moment can make a test or hook take several times its usual seconds. Tests wait for
// conditions, so this is only an upper bound, well above Jest's 5 s default. (Jest reads
// `testTimeout` from the global config only, not from a project, hence this file.)
jest.setTimeout(60_000);
