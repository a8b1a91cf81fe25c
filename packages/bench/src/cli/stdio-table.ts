import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Writable } from "node:stream";
import { readTable, type ReadTableOptions, type Table } from "@floorcast/sampler";
import type { CommandContext } from "./command-context.js";

/** The file name that means standard input (for a file read) or standard output (for a file written). */
export const STDIO_PATH = "-";

/**
 * Runs `use` on a CSV file given as a path, or on the command's stdin when the path is `-`
 * (buffered into a temporary file named `stdin`, so errors read "stdin: …"; removed afterwards),
 * so the file can be read more than once.
 * @param ctx - the command's streams.
 * @param path - a file path or `-`.
 * @param use - what to do with the readable file.
 * @returns what `use` returns.
 */
export async function withTableFile<T>(ctx: CommandContext, path: string, use: (file: string) => Promise<T>): Promise<T> {
  if (path !== STDIO_PATH) return use(path);
  const chunks: Buffer[] = [];
  for await (const chunk of ctx.stdin) chunks.push(typeof chunk === "string" ? Buffer.from(chunk) : (chunk as Buffer));
  const dir = await mkdtemp(join(tmpdir(), "floorcast-stdin-"));
  try {
    const file = join(dir, "stdin");
    await writeFile(file, Buffer.concat(chunks));
    return await use(file);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/**
 * Reads a CSV table from a path, or from the command's stdin when the path is `-` (see {@link withTableFile}).
 * @param ctx - the command's streams.
 * @param path - a file path or `-`.
 * @param options - readTable's options.
 * @returns the table.
 */
export function readTableArg(ctx: CommandContext, path: string, options: ReadTableOptions): Promise<Table> {
  return withTableFile(ctx, path, (file) => readTable(file, options));
}

/**
 * A writable that passes everything on to `out` (the command's stdout) and never ends it, so a
 * writer that ends its sink when done leaves stdout open for later messages.
 * @param out - the stream to write to.
 * @returns the forwarding stream.
 */
export function stdoutSink(out: NodeJS.WritableStream): Writable {
  return new Writable({
    write(chunk: Buffer, _encoding, done) {
      if (out.write(chunk)) done();
      else out.once("drain", () => done());
    },
  });
}
