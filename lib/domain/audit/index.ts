export type { AuditEntry, ChainCheck } from "./types";
export { canonicalJson } from "./canonical-json";
export { GENESIS_HASH, auditHashInput } from "./audit-hash";
export { chainVerifier } from "./verify-chain";
