export * from "./auth";
export * from "./kits";
export * from "./library";
export * from "./preferences";
export * from "./test-log";
export * from "./mail";
export * from "./sharing";
export * from "./searches";
