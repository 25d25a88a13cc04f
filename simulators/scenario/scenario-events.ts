/**
 * The events of the demo month (SCENARIO.md plus the simulator's own): each at a local time of
 * the site's zone on a day of "the demo month", the calendar month before the current one.
 */

/** KFG-102's DP transmitter flat-lines for an hour on day 3 (SCENARIO.md). */
export const FROZEN_TRANSMITTER = {
  tag: 'KFG-102-DP',
  siteCode: 'KFG',
  day: 3,
  hour: 10,
  minute: 0,
  durationMinutes: 60,
} as const;

/** KFG-103 sends nothing for 40 minutes (SCENARIO.md's dropout; the day and time are invented). */
export const DROPOUT = {
  meterRunTag: 'KFG-103',
  siteCode: 'KFG',
  day: 12,
  hour: 2,
  minute: 15,
  durationMinutes: 40,
} as const;

/**
 * Late data (invented): Pad 3's radio link stores and forwards. In live mode the readings of
 * KFG-103 timed in the first `blockMinutes` from minute `minute` of every hour are held back and
 * sent `releaseAfterMinutes` after the block began, newest first (late and out of order).
 */
export const LATE_DATA = { meterRunTag: 'KFG-103', minute: 40, blockMinutes: 5, releaseAfterMinutes: 8 } as const;
