export { bottleneckDistance } from "./bottleneck-distance.js";
export { DEFAULT_DISTANCE_BYTES, DistanceBudgetError } from "./distance-budget-error.js";
export {
  type BarsOf,
  diagramOf,
  type EssentialRule,
  finiteDiagram,
  type PersistenceDiagram,
} from "./persistence-diagram.js";
export { type WassersteinOptions, wassersteinDistance } from "./wasserstein-distance.js";
