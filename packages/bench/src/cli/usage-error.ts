/**
 * A mistake in how a command was called (a missing option, an unreadable file, a bad value).
 * The CLI prints its message without a stack trace and exits with status 2.
 */
export class UsageError extends Error {
  override readonly name = "UsageError";
}
