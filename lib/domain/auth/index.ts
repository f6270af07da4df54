export type { SessionTimeouts, SessionState, ThrottleRule, ThrottleState, ThrottleDecision } from "./types";
export {
  SESSION_TIMEOUTS,
  SESSION_TOUCH_INTERVAL_SECONDS,
  evaluateSession,
  sessionNeedsTouch,
  sessionExpiresAt,
} from "./session-policy";
export { ACCOUNT_THROTTLE, ADDRESS_THROTTLE, throttleDecision, recordFailure } from "./throttle";
export { PASSWORD_MIN_LENGTH, PASSWORD_MAX_LENGTH, passwordProblem } from "./password-policy";
