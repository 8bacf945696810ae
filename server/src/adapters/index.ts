// Outside services the modules use, injected through createApp so tests can swap them.
// Each is an interface plus its local stand-in; the mailer and the file store will join here.
import { systemClock, type Clock } from './clock';

export interface Adapters {
  clock: Clock;
}

export const defaultAdapters = (): Adapters => ({ clock: systemClock });

export type { Clock } from './clock';
