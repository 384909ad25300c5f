export { type AxisPositions, axisPositions } from "./axis-positions.js";
export { erf, normalMass } from "./error-function.js";
export {
  PERSISTENCE_CURVE_KINDS,
  type PersistenceCurveKind,
  persistenceCurve,
} from "./persistence-curve.js";
export { type PersistenceImageOptions, persistenceImage } from "./persistence-image.js";
export { persistenceLandscape } from "./persistence-landscape.js";
export { type EssentialHandling, type WindowedDiagram, windowedDiagram } from "./windowed-diagram.js";
