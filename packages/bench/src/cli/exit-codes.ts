/** Exit statuses shared by every `floorcast` command. */
export const EXIT_CODES = {
  /** Everything asked for was done. */
  success: 0,
  /** The command ran, but some inputs failed (each failure is reported). */
  someFailed: 1,
  /** The command was called wrongly: unknown option, missing file, bad value. */
  usage: 2,
} as const;
