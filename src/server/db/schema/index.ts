export * from "./auth";
export * from "./kits";
export * from "./preferences";
