import seedrandom from "seedrandom";
import { buildTrustReport, buildValidityDomain, type Surrogate, type TrustFigureData, type TrustReport } from "@floorcast/surrogate";

/**
 * A small trust report with every section (calibration, by regime, learning curve, domain) for the
 * rendering tests: a toy model y ≈ 2a + b with sd 0.5 on seeded data.
 */
export function sampleTrustReport(): { report: TrustReport; figures: TrustFigureData } {
  const rng = seedrandom("report-fixture");
  const x = Array.from({ length: 120 }, () => [rng() * 10, rng() * 5, rng()]);
  const y = x.map(([a, b]) => 2 * a! + b! + (rng() - 0.5));
  const model: Surrogate = {
    kind: "toy",
    inputs: ["frontage", "depth", "skew <b>"],
    targets: ["gfa"],
    predict: (rows) => ({ mean: rows.map(([a, b]) => [2 * a! + b!]), sd: rows.map(() => [0.5]) }),
    toJSON: () => ({ modelType: "toy", training: { n: 120, diagnostics: { jitter: 1e-9, conditionNumber: 1e4, onBounds: [] } } }),
  };
  const built = buildTrustReport({
    model,
    target: "gfa",
    x,
    y,
    groups: x.map(([a]) => (a! > 6 ? "far" : a! > 3 ? "height" : "plate")),
    groupColumn: "limitedBy",
    domain: buildValidityDomain(model.inputs, x.slice(0, 80)),
    learningCurve: {
      target: "gfa",
      seed: 1,
      points: [50, 100, 200].map((s) => ({ size: s, rmse: 10 * s ** -0.5, mae: 8 * s ** -0.5, maxAbsError: 30 * s ** -0.5 })),
      powerLaw: { slope: -0.5, coefficient: 10, r2LogLog: 1 },
    },
    sources: { model: "model.json", data: "test.csv" },
  });
  return built;
}

/** Number of figures the sample report has: parity, residuals, histogram, learning curve, calibration, by regime. */
export const SAMPLE_FIGURES = 6;
