// Every table, split by concern. drizzle-kit and the better-auth adapter both read this.
export * from "./auth.ts";
export * from "./mail.ts";
export * from "./chamber.ts";
export * from "./measures.ts";
export * from "./rulebooks.ts";
export * from "./floor.ts";
export * from "./rulings.ts";
export * from "./estimates.ts";
export * from "./rate-limit.ts";
export * from "./auth-throttle.ts";
export * from "./journal.ts";
export * from "./chamber-text.ts";
export * from "./people-audit.ts";
