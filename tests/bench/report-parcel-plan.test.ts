// The parcel plan and the Markdown helpers of the parcel ranking: edge cases (no parcel, a degenerate outline, equal
// or missing capacities, hostile ids) and the table helper's escaping.
import { describe, expect, it } from "vitest";
import { markdownTable, parcelCapacityPlan } from "@floorcast/bench";

const square = (x: number): [number, number][] => [[x, 0], [x + 10, 0], [x + 10, 10], [x, 10]];
const fills = (html: string): string[] => [...html.matchAll(/<polygon [^>]*fill="(#[0-9a-f]{6})"/g)].map((m) => m[1]!);

describe("parcelCapacityPlan", () => {
  it("fills the least capacity with the ramp's first stop and the most with its last (viridis, matplotlib)", () => {
    const html = parcelCapacityPlan(
      [
        { id: "a", vertices: square(0), capacity: 100, rank: 2 },
        { id: "b", vertices: square(20), capacity: 300, rank: 1 },
        { id: "c", vertices: square(40), capacity: 200, rank: 3 },
      ],
      "caption",
      "best gfa",
    );
    const [a, b, c] = fills(html);
    expect(a).toBe("#440154");
    expect(b).toBe("#fde725");
    // halfway: the middle stop #21918c exactly (derived: 0.5 × 4 = stop 2)
    expect(c).toBe("#21918c");
    expect(html).toMatch(/^<figure>\n<svg /);
    expect(html).toMatch(/<figcaption>caption<\/figcaption>/);
  });

  it("a parcel without a capacity (null, NaN) is grey; equal capacities take the top colour", () => {
    const html = parcelCapacityPlan(
      [
        { id: "a", vertices: square(0), capacity: 5, rank: 1 },
        { id: "b", vertices: square(20), capacity: 5, rank: 2 },
        { id: "c", vertices: square(40), capacity: null, rank: 3 },
        { id: "d", vertices: square(60), capacity: Number.NaN, rank: 4 },
      ],
      "c",
      "u",
    );
    expect(fills(html)).toEqual(["#fde725", "#fde725", "#bbbbbb", "#bbbbbb"]);
  });

  it("escapes ids, caption and unit; north is up (larger y drawn higher)", () => {
    const html = parcelCapacityPlan([{ id: "<x>&", vertices: [[0, 0], [10, 0], [10, 50]], capacity: 1, rank: 1 }], "a < b", "m² & more");
    expect(html).not.toMatch(/<x>/);
    expect(html).toMatch(/&lt;x&gt;&amp;/);
    expect(html).toMatch(/a &lt; b/);
    const pts = html.match(/points="([^"]+)"/)![1]!.split(" ").map((p) => p.split(",").map(Number));
    expect(pts[2]![1]!).toBeLessThan(pts[0]![1]!); // y = 50 m is nearer the top of the drawing than y = 0
  });

  it("refuses no parcel or an outline of fewer than 3 vertices", () => {
    expect(() => parcelCapacityPlan([], "c", "u")).toThrow(/parcelCapacityPlan: parcels must hold at least one parcel/);
    expect(() => parcelCapacityPlan([{ id: "p", vertices: [[0, 0], [1, 1]], capacity: 1, rank: 1 }], "c", "u")).toThrow(/parcel p has fewer than 3 vertices/);
  });
});

describe("markdownTable", () => {
  it("escapes pipes in cells and writes one separator row (GitHub-flavoured Markdown)", () => {
    expect(markdownTable(["a|b", "c"], [["1", "x|y"]])).toBe("| a\\|b | c |\n| --- | --- |\n| 1 | x\\|y |");
    expect(markdownTable(["h"], [])).toBe("| h |\n| --- |");
  });
});
