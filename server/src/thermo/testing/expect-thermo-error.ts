import { ThermoError } from '../errors/thermo-error';

/** Runs `run` and returns the ThermoError it throws; anything else (or nothing) fails the test. */
export function thermoFailure(run: () => unknown): ThermoError {
  try {
    run();
  } catch (err) {
    if (err instanceof ThermoError) return err;
    throw err;
  }
  throw new Error('expected a ThermoError');
}
