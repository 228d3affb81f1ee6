/** Verification of signed summaries: the shared, browser-safe implementation, used by the server as is. */
export { verifySummary, type SummaryVerification } from "../../shared/verify-summary.js";
