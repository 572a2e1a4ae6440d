import { layerPredictRequestSchema } from "../knowledge/contracts/layers";
import { predictLayers } from "../knowledge/layers";
import { LAYER_BODY } from "./http";

export interface ClientComputeReport {
  calls: number;
  /** the layer screen's work per check: validate with the shared schema, then predictLayers */
  predictUs: number;
  /** predictLayers alone */
  predictOnlyUs: number;
  /** baseline: a JSON round trip of the same request (what sending it to the server costs at least) */
  jsonRoundTripUs: number;
  ratio: number;
}

function perCallUs(calls: number, fn: () => unknown): number {
  for (let i = 0; i < Math.min(2000, calls); i++) fn(); // let the JIT settle
  const t0 = performance.now();
  for (let i = 0; i < calls; i++) fn();
  return ((performance.now() - t0) * 1000) / calls;
}

/** One layer prediction as the browser runs it, µs per call over many calls. */
export function benchClientCompute(calls: number): ClientComputeReport {
  const parsed = layerPredictRequestSchema.parse(LAYER_BODY);
  const predictUs = perCallUs(calls, () => predictLayers(layerPredictRequestSchema.parse(LAYER_BODY)));
  const predictOnlyUs = perCallUs(calls, () => predictLayers(parsed));
  const jsonRoundTripUs = perCallUs(calls, () => JSON.parse(JSON.stringify(LAYER_BODY)));
  return { calls, predictUs, predictOnlyUs, jsonRoundTripUs, ratio: predictUs / jsonRoundTripUs };
}
