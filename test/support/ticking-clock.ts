import { vi } from "vitest";

/**
 * Makes Date.now move `step` ms at every reading (restore with vi.restoreAllMocks or the returned spy's
 * mockRestore): at 1,100 ms every clock check passes WorkMonitor's 1 s default interval and reports.
 */
export function tickingClock(step = 1100) {
  let clock = 0;
  return vi.spyOn(Date, "now").mockImplementation(() => {
    clock += step;
    return clock;
  });
}
