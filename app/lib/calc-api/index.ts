// The calculators' public face: schemas and limits (pure), the calculations (pure), the HTTP edge.
export * from "./schemas";
export * from "./calculations";
export * from "./docs";
export * from "./examples";
export * from "./http.server";
