export * from "./core";
export * from "./bench";
export * from "./sync";
