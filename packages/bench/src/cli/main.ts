import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import { Command, CommanderError } from "commander";
import { claimOutput, type ClaimedOutput } from "@floorcast/sampler";
import type { CommandContext } from "./command-context.js";
import { EXIT_CODES } from "./exit-codes.js";
import { UsageError } from "./usage-error.js";
import { registerCommands } from "./register-commands.js";
import { CLI_VERSION } from "./cli-version.js";
import { requiredOptionsAfterUnknown } from "./required-options.js";


/**
 * Runs the `floorcast` command line.
 * @param argv - process.argv-style arguments (node, script, ...args).
 * @param io - streams to use; defaults to the process's own.
 * @returns the exit status: 0 success, 1 some inputs failed, 2 usage error.
 */
export async function main(argv: readonly string[], io?: Partial<CommandContext>): Promise<number> {
  let exitCode: number = EXIT_CODES.success;
  const claims: ClaimedOutput[] = [];
  const ctx: CommandContext = {
    stdin: io?.stdin ?? process.stdin,
    stdout: io?.stdout ?? process.stdout,
    stderr: io?.stderr ?? process.stderr,
    setExitCode(code: number) {
      exitCode = Math.max(exitCode, code);
    },
    async claimOutput(command, paths, options) {
      const inputs = (options.inputs ?? []).filter((p): p is string => p !== undefined && p !== "-"); // "-" is stdin, not a file
      const claim = await claimOutput(paths, { fn: command, force: options.force === true, inputs });
      claims.push(claim);
      return claim;
    },
  };
  const program = new Command("floorcast")
    .description("Fast, validated surrogates of an exact floor-area (massing) calculation.")
    // every help page (the top level's and each command's) ends with the one caution, once
    .addHelpText("afterAll", `\n${FLOORCAST_CAUTION}`)
    .version(CLI_VERSION, "-V, --version", "print the version of floorcast and exit")
    .exitOverride()
    .configureOutput({
      writeOut: (s) => ctx.stdout.write(s),
      writeErr: (s) => ctx.stderr.write(s),
    });
  await registerCommands(program, ctx, argv);
  requiredOptionsAfterUnknown(program);
  try {
    await program.parseAsync(argv as string[]);
  } catch (error) {
    if ((error as { code?: unknown } | null)?.code === "EPIPE") return exitCode; // the reader closed the pipe: end quietly
    if (error instanceof CommanderError) {
      if (error.exitCode === 0) return EXIT_CODES.success;
      return EXIT_CODES.usage;
    }
    if (error instanceof UsageError || error instanceof RangeError || error instanceof TypeError || isPathError(error)) {
      ctx.stderr.write(`floorcast: ${error.message}\n`);
      return EXIT_CODES.usage;
    }
    ctx.stderr.write(`floorcast: ${error instanceof Error ? error.message : String(error)}\n`);
    return EXIT_CODES.someFailed;
  } finally {
    await Promise.all(claims.map((c) => c.release()));
  }
  return exitCode;
}

/** File-system codes that mean a path the user gave cannot be read or written (a usage error, exit 2). */
const PATH_ERROR_CODES = new Set(["ENOENT", "EACCES", "EPERM", "EISDIR", "ENOTDIR", "EEXIST", "EROFS", "ENAMETOOLONG"]);

/** A Node system error about a path (not about starting a program: an evaluator that fails exits 1). */
function isPathError(error: unknown): error is Error {
  if (!(error instanceof Error)) return false;
  const { code, syscall } = error as { code?: unknown; syscall?: unknown };
  return typeof code === "string" && PATH_ERROR_CODES.has(code) && !(typeof syscall === "string" && syscall.startsWith("spawn"));
}
