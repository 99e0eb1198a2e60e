/**
 * The flow-bench engine: pure TypeScript, no framework, no Node-only APIs, so the server, the
 * browser forms and the CLI all compute the same figures.
 */
export * from "./units";
export * from "./air";
export * from "./orifice";
export * from "./valve";
export * from "./engine";
export * from "./interpolate";
export * from "./labels";
export * from "./schema";
export * from "./compute";
export * from "./compare";
export * from "./estimates";
export * from "./csv";
export * from "./demo";
