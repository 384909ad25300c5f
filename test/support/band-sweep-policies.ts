import type { BandSweepPolicy } from "../../packages/core/src/homology/band-sweep.js";

/**
 * Policies that force the sweep over bands onto graphs small enough for a test (the default policy leaves
 * dimensions under 16,384 simplices to the implicit reduction), each reaching a different way of ending.
 */
export const sweepPolicies: Record<string, BandSweepPolicy> = {
  // Bands of a few columns to the end of the filtration: every column settled by the sweep, classes that
  // never die found as columns still carried at the end.
  wholeFiltration: {
    fromSimplices: 0,
    upToDim: Number.POSITIVE_INFINITY,
    firstBandColumns: 3,
    rowsPerBand: 32,
    handOffAt: -1,
    stopRows: Number.POSITIVE_INFINITY,
    maxRows: Number.POSITIVE_INFINITY,
    maxBandEntries: Number.POSITIVE_INFINITY,
  },
  // Stops early, handing the few columns still carried to the implicit reduction.
  earlyHandOff: {
    fromSimplices: 0,
    upToDim: Number.POSITIVE_INFINITY,
    firstBandColumns: 2,
    rowsPerBand: 16,
    handOffAt: 4,
    stopRows: 64,
    maxRows: Number.POSITIVE_INFINITY,
    maxBandEntries: Number.POSITIVE_INFINITY,
  },
  // One band, then everything carried is handed off, however many.
  oneBand: {
    fromSimplices: 0,
    upToDim: Number.POSITIVE_INFINITY,
    firstBandColumns: 8,
    rowsPerBand: 64,
    handOffAt: -1,
    stopRows: Number.POSITIVE_INFINITY,
    maxRows: 0,
    maxBandEntries: Number.POSITIVE_INFINITY,
  },
  // Bands growing until one would hold more than 300 coface entries: the sweep stops before it.
  entryCap: {
    fromSimplices: 0,
    upToDim: Number.POSITIVE_INFINITY,
    firstBandColumns: 2,
    rowsPerBand: 1024,
    handOffAt: -1,
    stopRows: Number.POSITIVE_INFINITY,
    maxRows: Number.POSITIVE_INFINITY,
    maxBandEntries: 300,
  },
};
