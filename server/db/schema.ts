// Every Drizzle table, by area. drizzle-kit reads this file to generate migrations.
export * from "./tables/foundation.js";
export * from "./tables/signatures.js";
export * from "./tables/masterData.js";
export * from "./tables/campaigns.js";
export * from "./tables/execution.js";
export * from "./tables/review.js";
export * from "./tables/training.js";
