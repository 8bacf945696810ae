// API and reference tests each clone a database and run real queries on a shared machine: a busy
// moment can make a hook take several seconds. Their waits are for conditions, so this is only an
// upper bound, well above Jest's 5 s default. (Jest reads `testTimeout` from the global config
// only, not from a project, hence this file.)
jest.setTimeout(60_000);
