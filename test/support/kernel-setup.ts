/** vitest globalSetup: tests import the core's sources, which import the generated kernel module. */
import { buildKernel } from "./built-core.js";

export default function setup(): void {
  buildKernel();
}
