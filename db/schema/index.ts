export * from "./core";
export * from "./counter";
export * from "./bench";
export * from "./sync";
