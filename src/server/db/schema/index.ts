export * from "./auth";
export * from "./kits";
