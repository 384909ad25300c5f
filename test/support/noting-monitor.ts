import { WorkMonitor } from "../../packages/core/src/work/work-monitor.js";

/**
 * A WorkMonitor that notes its clock checks: the work done at each (`checks`, a stage's own check at its
 * begin included) and how many each stage made after its begin (`afterBegin`, one entry per stage).
 */
export class NotingMonitor extends WorkMonitor {
  checks: number[] = [];
  afterBegin: number[] = [];
  private beginning = false;

  override begin(stage: Parameters<WorkMonitor["begin"]>[0], dim: number, total: number): void {
    this.beginning = true;
    super.begin(stage, dim, total);
    this.beginning = false;
    this.afterBegin.push(0);
  }

  override check(done: number): void {
    this.checks.push(done);
    if (!this.beginning && this.afterBegin.length > 0) this.afterBegin[this.afterBegin.length - 1]++;
    super.check(done);
  }
}
