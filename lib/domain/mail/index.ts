export { OUTBOX_MAX_ATTEMPTS, nextAttemptDelaySeconds } from "./backoff";
