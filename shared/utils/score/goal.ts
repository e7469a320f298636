// The goal share: the organisation's setting, and the one rule for "at the goal" (the engine, the score tiles,
// pledges and the dashboard all ask `meetsGoal`).

/** The goal when the organisation has not set one: 70 % native. */
export const DEFAULT_GOAL = 0.7
/** A coordinator sets the goal between these (inclusive). */
export const GOAL_MIN = 0.5
export const GOAL_MAX = 1

/**
 * A share this far below the goal still meets it: floating-point dust from summing areas (a yard exactly at
 * 70 % can come out as 0.6999999999999998), far below anything a person sees (shares show to 0.1 %).
 */
export const GOAL_TOLERANCE = 1e-9

/** The share is at or above the goal (an empty share, null, has nothing to meet). */
export function meetsGoal(share: number | null | undefined, goal: number): boolean {
  return share !== null && share !== undefined && share >= goal - GOAL_TOLERANCE
}
