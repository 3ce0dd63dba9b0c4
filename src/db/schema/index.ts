export * from "./users";
export * from "./audit";
export * from "./settings";
export * from "./forecast";
