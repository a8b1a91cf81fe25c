import { createReadStream } from "node:fs";
import { access, constants, stat } from "node:fs/promises";
import { once } from "node:events";
import { createInterface } from "node:readline";
import type { Readable } from "node:stream";
import type { Command } from "commander";
import { evaluateMassing } from "@floorcast/sampler";
import type { CommandContext } from "../command-context.js";
import { EXIT_CODES } from "../exit-codes.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { STDIO_PATH } from "../stdio-table.js";
import { UsageError } from "../usage-error.js";

interface MassingOptions {
  input?: string;
  plates?: boolean;
}

/** One failed line, written in the line's place. */
interface LineError {
  error: { line: number; field: string; message: string };
}

/** Lines written per stdout write (fewer syscalls on large inputs). */
const BATCH = 256;

function lineError(line: number, error: unknown): LineError {
  if (error instanceof SyntaxError) {
    return { error: { line, field: "(json)", message: `not valid JSON: ${error.message}` } };
  }
  if (error instanceof TypeError || error instanceof RangeError) {
    // evaluateMassing's messages read "evaluateMassing: <field path> …".
    const m = /^evaluateMassing: (\S+) /.exec(error.message);
    return { error: { line, field: m?.[1] ?? "(input)", message: error.message } };
  }
  throw error;
}

async function openInput(ctx: CommandContext, file: string | undefined): Promise<Readable> {
  if (file === undefined || file === STDIO_PATH) return ctx.stdin;
  try {
    await access(file, constants.R_OK);
    if (!(await stat(file)).isFile()) throw new Error("not a file");
  } catch {
    throw new UsageError(`massing: cannot read --input ${JSON.stringify(file)} (not a readable file)`);
  }
  return createReadStream(file, { encoding: "utf8" });
}

/**
 * `floorcast massing`: evaluates the exact massing rule on JSON Lines of MassingInput (stdin or
 * `--input FILE`) and writes one JSON line of MassingResult per input line, in order; a bad line gets
 * `{"error": {"line", "field", "message"}}` in its place and the exit status becomes 1. Blank lines are
 * skipped (they still count in line numbers). Before the first result, the caution (FLOORCAST_CAUTION) goes
 * to stderr once: estimates for early feasibility studies, not a zoning determination.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerMassingCommand(program: Command, ctx: CommandContext): void {
  program
    .command("massing")
    .description(
      "Evaluate the exact massing rule on JSON Lines of massing inputs (one result line per input line; the caution goes to stderr).",
    )
    .option("--input <file>", "read JSON Lines from this file instead of stdin (- is stdin)")
    .option("--plates", "include the floor plates (polygons, floor by floor) in each result")
    .action(async (opts: MassingOptions) => {
      const source = await openInput(ctx, opts.input);
      const options = { plates: opts.plates === true };
      const lines = createInterface({ input: source, crlfDelay: Infinity });
      let lineNo = 0;
      let failed = 0;
      let pending: string[] = [];
      let cautioned = false;
      const flush = async (): Promise<void> => {
        if (pending.length === 0) return;
        if (!cautioned) {
          // once, before the first result: whoever reads the results has seen the caution (stderr keeps stdout pure JSON Lines)
          cautioned = true;
          ctx.stderr.write(`${FLOORCAST_CAUTION}\n`);
        }
        const text = pending.join("");
        pending = [];
        if (!ctx.stdout.write(text)) await once(ctx.stdout, "drain");
      };
      for await (const raw of lines) {
        lineNo++;
        const text = raw.trim();
        if (text === "") continue;
        let out: unknown;
        try {
          out = evaluateMassing(JSON.parse(text) as never, options);
        } catch (error) {
          out = lineError(lineNo, error);
          failed++;
        }
        pending.push(`${JSON.stringify(out)}\n`);
        if (pending.length >= BATCH) await flush();
      }
      await flush();
      if (failed > 0) {
        ctx.stderr.write(`massing: ${failed} of the input lines failed (see their "error" lines)\n`);
        ctx.setExitCode(EXIT_CODES.someFailed);
      }
    });
}
