/** One string literal of a JavaScript/TypeScript source: its text (template pieces joined by `${…}`) and 1-based line. */
export interface StringLiteral {
  readonly text: string;
  readonly line: number;
}

// After one of these characters (or at the start, or after a keyword such as `return`) a "/" opens a regular
// expression, not a division (common practice for hand-written JavaScript tokenizers).
const BEFORE_REGEX = new Set("(,=:[!&|?{};+-*%<>~^".split(""));
const KEYWORDS_BEFORE_EXPRESSION = /^(return|typeof|case|do|else|in|of|new|delete|void|throw|yield|await)$/;

/**
 * The string literals of a JavaScript/TypeScript source, with comments (TSDoc included) skipped: single- and
 * double-quoted strings and template literals (their text pieces; expressions inside `${…}` are scanned for their
 * own literals). Regular-expression literals are skipped. A small tokenizer written for the caution test (the
 * workspace's TypeScript 7 has no JavaScript parser API); it throws on an unterminated literal or comment.
 * @param source - the file's text.
 * @returns the literals in order of appearance.
 */
export function stringLiterals(source: string): StringLiteral[] {
  const out: StringLiteral[] = [];
  const braces: ("code" | "template")[] = []; // what each open "{" belongs to
  let i = 0;
  let line = 1;
  let last = ""; // last significant character outside comments and literals
  const fail = (what: string, at: number) => {
    throw new SyntaxError(`stringLiterals: unterminated ${what} starting on line ${at}`);
  };
  const template = (start: number) => {
    // i is just after "`" or after the "}" closing a ${…}; reads to the closing "`" or the next "${"
    let text = "";
    for (;;) {
      if (i >= source.length) fail("template literal", start);
      const c = source[i]!;
      if (c === "\\") { text += source.slice(i, i + 2); if (source[i + 1] === "\n") line++; i += 2; continue; }
      if (c === "`") { i++; return { text, open: false }; }
      if (c === "$" && source[i + 1] === "{") { i += 2; return { text, open: true }; }
      if (c === "\n") line++;
      text += c;
      i++;
    }
  };
  // template literals whose ${…} is open, innermost last
  const pendingStack: { text: string; line: number }[] = [];
  while (i < source.length) {
    const c = source[i]!;
    const next = source[i + 1];
    if (c === "\n") { line++; i++; continue; }
    if (/\s/.test(c)) { i++; continue; }
    if (c === "/" && next === "/") { while (i < source.length && source[i] !== "\n") i++; continue; }
    if (c === "/" && next === "*") {
      const start = line;
      const end = source.indexOf("*/", i + 2);
      if (end < 0) fail("comment", start);
      for (let k = i; k < end; k++) if (source[k] === "\n") line++;
      i = end + 2;
      continue;
    }
    if (c === "'" || c === '"') {
      const start = line;
      let text = "";
      i++;
      for (;;) {
        if (i >= source.length || source[i] === "\n") fail("string", start);
        if (source[i] === "\\") { text += source.slice(i, i + 2); i += 2; continue; }
        if (source[i] === c) { i++; break; }
        text += source[i];
        i++;
      }
      out.push({ text, line: start });
      last = c;
      continue;
    }
    if (c === "`") {
      const start = line;
      i++;
      const piece = template(start);
      if (piece.open) { pendingStack.push({ text: `${piece.text}\${…}`, line: start }); braces.push("template"); }
      else out.push({ text: piece.text, line: start });
      last = "`";
      continue;
    }
    if (c === "{") { braces.push("code"); i++; last = c; continue; }
    if (c === "}") {
      i++;
      if (braces.pop() === "template") {
        const pending = pendingStack.pop()!;
        const piece = template(pending.line);
        if (piece.open) { pendingStack.push({ text: `${pending.text}${piece.text}\${…}`, line: pending.line }); braces.push("template"); }
        else out.push({ text: pending.text + piece.text, line: pending.line });
        last = "`";
      } else last = c;
      continue;
    }
    if (c === "/" && (last === "" || BEFORE_REGEX.has(last))) {
      const start = line;
      let inClass = false;
      i++;
      for (;;) {
        if (i >= source.length || source[i] === "\n") fail("regular expression", start);
        const r = source[i]!;
        if (r === "\\") { i += 2; continue; }
        if (r === "[") inClass = true;
        else if (r === "]") inClass = false;
        else if (r === "/" && !inClass) { i++; break; }
        i++;
      }
      while (i < source.length && /[a-z]/i.test(source[i]!)) i++; // flags
      last = "/";
      continue;
    }
    if (/[\w$]/.test(c)) {
      // a whole word, so that a keyword before a regular expression is recognised
      const start = i;
      while (i < source.length && /[\w$]/.test(source[i]!)) i++;
      last = KEYWORDS_BEFORE_EXPRESSION.test(source.slice(start, i)) ? "(" : "a";
      continue;
    }
    // TypeScript's non-null assertion (`x!`, `a[i]!`) ends an expression, as `x` does
    if (!(c === "!" && (last === "a" || last === ")" || last === "]"))) last = c;
    i++;
  }
  if (pendingStack.length > 0) fail("template literal", pendingStack.at(-1)!.line);
  return out;
}
