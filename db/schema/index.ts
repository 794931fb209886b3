export * from "./core";
export * from "./counter";
