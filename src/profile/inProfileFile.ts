import { InputError, withLocation } from "../errors/InputError.js";

/**
 * Run a computation on a loaded profile and give any problem it finds that names no file (a
 * circuit model refusing a load, a repeat's period overrun found while the events run) the
 * profile's file, so the CLI can look up its line.
 * @param file the profile's file (`DutyProfile.file`)
 * @param compute the work on the profile
 * @throws InputError what `compute` throws, each problem with the file filled in
 */
export function inProfileFile<T>(file: string, compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof InputError) throw withLocation(error, file);
    throw error;
  }
}
