export * from "./unitCatalog.js";
export * from "./convert.js";
export * from "./parseUnit.js";
