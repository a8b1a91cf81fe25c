import type { TopLevelSpec } from "vega-lite";

/**
 * Renders a Vega-Lite specification to a standalone SVG string in Node: Vega-Lite compiles it to Vega
 * (`compile`), Vega parses and runs the dataflow headless (`renderer: "none"`) and serialises the scene
 * to SVG (`View.toSVG`). Data must be inline (`data.values`): loading is disabled, nothing is fetched. Both chart
 * packages are loaded on the first call, so importing the report renderers costs nothing until a chart is drawn.
 * @param spec - a Vega-Lite top-level spec with inline data.
 * @returns the SVG markup.
 */
export async function chartSvg(spec: TopLevelSpec): Promise<string> {
  if (typeof spec !== "object" || spec === null) throw new TypeError("chartSvg: spec must be a Vega-Lite specification object");
  const [{ compile }, { parse, View }] = await Promise.all([import("vega-lite"), import("vega")]);
  const vega = compile(spec).spec;
  // Every loader entry point refuses and records the attempt: Vega catches loader errors itself (and
  // would draw an empty chart), so the attempt is re-raised after rendering.
  const refused: string[] = [];
  const refuse = async (what: unknown) => {
    refused.push(String(what));
    throw new Error("chartSvg: external resources are not allowed");
  };
  const loader = { load: refuse, sanitize: refuse, http: refuse, file: refuse };
  const view = new View(parse(vega), { renderer: "none", loader: loader as never });
  try {
    const svg = await view.toSVG();
    if (refused.length > 0) throw new Error(`chartSvg: the spec asks for external data (${refused[0]}); give data.values inline`);
    return svg;
  } finally {
    view.finalize();
  }
}
