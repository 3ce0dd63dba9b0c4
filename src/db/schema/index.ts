export * from "./users";
export * from "./audit";
export * from "./settings";
export * from "./forecast";
export * from "./bulletins";
export * from "./dissemination";
export * from "./verification";
