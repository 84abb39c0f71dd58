// Projects, systems, candidates and selections, public face for loaders, actions and scripts (server
// only: it re-exports `.server` modules; browser code imports the pure files by path: hydraulics,
// system-form, workbench-view, search-view, candidate-judgement, energy, energy-form, adjust-form, stored-input).
export * from "./projects.server";
export * from "./selections.server";
export * from "./candidates.server";
export * from "./shares.server";
export * from "./share-offers.server";
export * from "./search.server";
export * from "./systems-api.server";
export * from "./selection-export.server";
export * from "./hydraulics";
export * from "./system-form";
export * from "./workbench-view";
export * from "./search-view";
export * from "./candidate-judgement";
export * from "./energy";
export * from "./energy-form";
export * from "./adjust-form";
export * from "./stored-input";
