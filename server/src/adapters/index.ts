// Outside services the modules use, injected through createApp so tests can swap them.
// Each is an interface plus its local stand-in; the mailer and the file store will join here.
import { systemClock, type Clock } from './clock';
import type { FileStore } from './file-store';

export interface Adapters {
  clock: Clock;
  /** Documents' bytes; by default the S3 store the configuration names. */
  fileStore?: FileStore;
}

export const defaultAdapters = (): Adapters => ({ clock: systemClock });

export type { Clock } from './clock';
