export type { AuditEntry, ChainCheck } from "./types";
export { canonicalJson } from "./canonical-json";
export { GENESIS_HASH, auditHashInput, auditHashTemplate, fillAuditHashTemplate } from "./audit-hash";
export type { AuditHashTemplate } from "./audit-hash";
export { chainVerifier } from "./verify-chain";
